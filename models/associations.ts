import { BoardAlias } from "./BoardAlias";
import { BoardModel } from "./BoardModel";
import { BoardRevision } from "./BoardRevision";
import { FirmwareFamily } from "./FirmwareFamily";
import { Manufacturer } from "./Manufacturer";
import { Submission } from "./Submission";
import { User } from "./User";

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
}
