import type { Sequelize } from "sequelize";
import { Account } from "./Account";
import { associate } from "./associations";
import { AuditEvent } from "./AuditEvent";
import { AuthSession } from "./AuthSession";
import { BoardAlias, BoardModel, BoardRevision } from "./Board";
import { BoardStat, type BoardStatRow } from "./BoardStat";
import { getSequelize } from "./connection";
import { EndedSession } from "./EndedSession";
import { EvidencePhoto } from "./EvidencePhoto";
import { FirmwareFamily } from "./FirmwareFamily";
import { IdempotencyKey } from "./IdempotencyKey";
import { Manufacturer } from "./Manufacturer";
import { Pack } from "./Pack";
import { PackCharge } from "./PackCharge";
import { PasswordResetToken } from "./PasswordResetToken";
import { PublishedValueHistory } from "./PublishedValueHistory";
import { Quad } from "./Quad";
import { RateLimit } from "./RateLimit";
import { SignUpToken } from "./SignUpToken";
import { Submission } from "./Submission";
import { SubmissionBenchPoint } from "./SubmissionBenchPoint";
import { SubmissionCycle } from "./SubmissionCycle";
import { SubmissionVoltageReading } from "./SubmissionVoltageReading";
import { User } from "./User";
import { VerificationToken } from "./VerificationToken";
import { Worksheet } from "./Worksheet";
import { WorksheetBenchPoint } from "./WorksheetBenchPoint";
import { WorksheetStep } from "./WorksheetStep";
import { WorksheetVoltageReading } from "./WorksheetVoltageReading";

export { BoardAlias, BoardModel, BoardRevision, EvidencePhoto, FirmwareFamily, Manufacturer, Submission, User };
export { SubmissionBenchPoint, SubmissionCycle, SubmissionVoltageReading };
export { Account, AuthSession, EndedSession, PasswordResetToken, SignUpToken, VerificationToken };
export { Pack, PackCharge, Quad, Worksheet, WorksheetStep, WorksheetVoltageReading, WorksheetBenchPoint };
export { familyUnitFieldsOf } from "./FirmwareFamily";
export { AuditEvent, BoardStat, PublishedValueHistory, type BoardStatRow };

let initialisedWith: Sequelize | undefined;

/** Binds every model to the app's Sequelize instance (once) and returns it. */
export function db(): Sequelize {
  const sequelize = getSequelize();
  if (initialisedWith !== sequelize) {
    for (const model of [
      Manufacturer,
      BoardModel,
      BoardRevision,
      BoardAlias,
      FirmwareFamily,
      User,
      Submission,
      EvidencePhoto,
      SubmissionVoltageReading,
      SubmissionCycle,
      SubmissionBenchPoint,
      IdempotencyKey,
      Account,
      AuthSession,
      EndedSession,
      VerificationToken,
      PasswordResetToken,
      SignUpToken,
      RateLimit,
      Quad,
      Pack,
      PackCharge,
      AuditEvent,
      PublishedValueHistory,
      BoardStat,
      Worksheet,
      WorksheetStep,
      WorksheetVoltageReading,
      WorksheetBenchPoint,
    ]) {
      model.initModel(sequelize);
    }
    associate();
    initialisedWith = sequelize;
  }
  return sequelize;
}
