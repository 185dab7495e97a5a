import { Account } from "./Account";
import { AuditEvent } from "./AuditEvent";
import { AuthSession } from "./AuthSession";
import { EndedSession } from "./EndedSession";
import { BoardAlias, BoardModel, BoardRevision } from "./Board";
import { BoardStat } from "./BoardStat";
import { EvidencePhoto } from "./EvidencePhoto";
import { FirmwareFamily } from "./FirmwareFamily";
import { Manufacturer } from "./Manufacturer";
import { Pack } from "./Pack";
import { PackCharge } from "./PackCharge";
import { PasswordResetToken } from "./PasswordResetToken";
import { PublishedValueHistory } from "./PublishedValueHistory";
import { Quad } from "./Quad";
import { IdempotencyKey } from "./IdempotencyKey";
import { Submission } from "./Submission";
import { SubmissionBenchPoint } from "./SubmissionBenchPoint";
import { SubmissionCycle } from "./SubmissionCycle";
import { SubmissionVoltageReading } from "./SubmissionVoltageReading";
import { User } from "./User";
import { Worksheet } from "./Worksheet";
import { WorksheetBenchPoint } from "./WorksheetBenchPoint";
import { WorksheetStep } from "./WorksheetStep";
import { WorksheetVoltageReading } from "./WorksheetVoltageReading";

// Every association lives here, so the graph can be read in one place.
export function associate(): void {
  Manufacturer.hasMany(BoardModel, { foreignKey: "manufacturerId", as: "boardModels" });
  BoardModel.belongsTo(Manufacturer, { foreignKey: "manufacturerId", as: "manufacturer" });

  BoardModel.hasMany(BoardRevision, { foreignKey: "boardModelId", as: "revisions" });
  BoardRevision.belongsTo(BoardModel, { foreignKey: "boardModelId", as: "boardModel" });

  BoardModel.hasMany(BoardAlias, { foreignKey: "boardModelId", as: "aliases" });
  BoardAlias.belongsTo(BoardModel, { foreignKey: "boardModelId", as: "boardModel" });

  BoardRevision.hasMany(Submission, { foreignKey: "boardRevisionId", as: "submissions" });
  Submission.belongsTo(BoardRevision, { foreignKey: "boardRevisionId", as: "boardRevision" });

  FirmwareFamily.hasMany(Submission, { foreignKey: "firmwareFamilyId", as: "submissions" });
  Submission.belongsTo(FirmwareFamily, { foreignKey: "firmwareFamilyId", as: "firmwareFamily" });

  User.hasMany(Submission, { foreignKey: "contributorId", as: "submissions" });
  Submission.belongsTo(User, { foreignKey: "contributorId", as: "contributor" });

  User.hasMany(EvidencePhoto, { foreignKey: "uploaderId", as: "evidencePhotos" });
  EvidencePhoto.belongsTo(User, { foreignKey: "uploaderId", as: "uploader" });

  Submission.hasMany(EvidencePhoto, { foreignKey: "submissionId", as: "evidencePhotos" });
  EvidencePhoto.belongsTo(Submission, { foreignKey: "submissionId", as: "submission" });

  // a submission's evidence, ordered by position when read
  Submission.hasMany(SubmissionVoltageReading, { foreignKey: "submissionId", as: "voltageReadings" });
  SubmissionVoltageReading.belongsTo(Submission, { foreignKey: "submissionId", as: "submission" });
  Submission.hasMany(SubmissionCycle, { foreignKey: "submissionId", as: "cycles" });
  SubmissionCycle.belongsTo(Submission, { foreignKey: "submissionId", as: "submission" });
  Submission.hasMany(SubmissionBenchPoint, { foreignKey: "submissionId", as: "benchPoints" });
  SubmissionBenchPoint.belongsTo(Submission, { foreignKey: "submissionId", as: "submission" });

  User.hasMany(IdempotencyKey, { foreignKey: "userId", as: "idempotencyKeys" });
  IdempotencyKey.belongsTo(User, { foreignKey: "userId", as: "user" });
  IdempotencyKey.belongsTo(Submission, { foreignKey: "submissionId", as: "submission" });

  // sign-in (lib/auth); @next-auth/sequelize-adapter adds its own unaliased belongsTo on top
  User.hasMany(Account, { foreignKey: "userId", as: "accounts" });
  Account.belongsTo(User, { foreignKey: "userId", as: "user" });
  User.hasMany(AuthSession, { foreignKey: "userId", as: "authSessions" });
  AuthSession.belongsTo(User, { foreignKey: "userId", as: "user" });
  User.hasMany(EndedSession, { foreignKey: "userId", as: "endedSessions" });
  EndedSession.belongsTo(User, { foreignKey: "userId", as: "user" });
  User.hasMany(PasswordResetToken, { foreignKey: "userId", as: "passwordResetTokens" });
  PasswordResetToken.belongsTo(User, { foreignKey: "userId", as: "user" });

  // the garage: private to its owner
  User.hasMany(Quad, { foreignKey: "ownerId", as: "quads" });
  Quad.belongsTo(User, { foreignKey: "ownerId", as: "owner" });
  Quad.belongsTo(BoardRevision, { foreignKey: "boardRevisionId", as: "boardRevision" });
  Quad.belongsTo(FirmwareFamily, { foreignKey: "firmwareFamilyId", as: "firmwareFamily" });
  User.hasMany(Pack, { foreignKey: "ownerId", as: "packs" });
  Pack.belongsTo(User, { foreignKey: "ownerId", as: "owner" });
  Pack.hasMany(PackCharge, { foreignKey: "packId", as: "charges" });
  PackCharge.belongsTo(Pack, { foreignKey: "packId", as: "pack" });

  // moderation (lib/moderation): the append-only log and the history of published values
  AuditEvent.belongsTo(User, { foreignKey: "actorId", as: "actor" });
  AuditEvent.belongsTo(User, { foreignKey: "targetUserId", as: "targetUser" });
  AuditEvent.belongsTo(Submission, { foreignKey: "submissionId", as: "submission" });
  Submission.hasMany(AuditEvent, { foreignKey: "submissionId", as: "auditEvents" });
  AuditEvent.belongsTo(AuditEvent, { foreignKey: "revertsEventId", as: "revertsEvent" });
  BoardStat.belongsTo(BoardRevision, { foreignKey: "boardRevisionId", as: "boardRevision" });
  BoardStat.belongsTo(FirmwareFamily, { foreignKey: "firmwareFamilyId", as: "firmwareFamily" });
  PublishedValueHistory.belongsTo(AuditEvent, { foreignKey: "causedByEventId", as: "causedBy" });
  PublishedValueHistory.belongsTo(BoardRevision, { foreignKey: "boardRevisionId", as: "boardRevision" });
  PublishedValueHistory.belongsTo(FirmwareFamily, { foreignKey: "firmwareFamilyId", as: "firmwareFamily" });
  User.hasMany(Worksheet, { foreignKey: "ownerId", as: "worksheets" });
  Worksheet.belongsTo(User, { foreignKey: "ownerId", as: "owner" });
  Quad.hasMany(Worksheet, { foreignKey: "quadId", as: "worksheets" });
  Worksheet.belongsTo(Quad, { foreignKey: "quadId", as: "quad" });
  Pack.hasMany(Worksheet, { foreignKey: "packId", as: "worksheets" });
  Worksheet.belongsTo(Pack, { foreignKey: "packId", as: "pack" });
  Worksheet.belongsTo(FirmwareFamily, { foreignKey: "firmwareFamilyId", as: "firmwareFamily" });
  Worksheet.hasMany(WorksheetStep, { foreignKey: "worksheetId", as: "steps" });
  WorksheetStep.belongsTo(Worksheet, { foreignKey: "worksheetId", as: "worksheet" });
  Worksheet.hasMany(WorksheetVoltageReading, { foreignKey: "worksheetId", as: "voltageReadings" });
  WorksheetVoltageReading.belongsTo(Worksheet, { foreignKey: "worksheetId", as: "worksheet" });
  Worksheet.hasMany(WorksheetBenchPoint, { foreignKey: "worksheetId", as: "benchPoints" });
  WorksheetBenchPoint.belongsTo(Worksheet, { foreignKey: "worksheetId", as: "worksheet" });
}
