import { DataTypes, Model } from "sequelize";
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from "sequelize";
import type { Method, SensingSource, SubmissionStatus } from "@/lib/vocabulary";
import type { BoardRevision } from "./Board";
import type { EvidenceSummary } from "./evidence-summary";
import type { FirmwareFamily } from "./FirmwareFamily";
import type { User } from "./User";

export class Submission extends Model<InferAttributes<Submission>, InferCreationAttributes<Submission>> {
  declare id: CreationOptional<number>;
  declare boardRevisionId: ForeignKey<BoardRevision["id"]>;
  declare firmwareFamilyId: ForeignKey<FirmwareFamily["id"]>;
  declare contributorId: ForeignKey<User["id"]>;
  declare firmwareVersion: string;
  declare sensingSource: SensingSource;
  declare method: Method;
  declare voltageScale: number | null;
  declare currentScale: number | null;
  declare currentOffset: number | null;
  declare status: CreationOptional<SubmissionStatus>;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  /** Set by lib/submissions from the evidence (migrations/20261205000100-…). */
  declare evidenceMismatch: CreationOptional<boolean>;
  declare evidenceSummary: EvidenceSummary | null;
  declare moderatorNote: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare boardRevision?: NonAttribute<BoardRevision>;
  declare firmwareFamily?: NonAttribute<FirmwareFamily>;
  declare contributor?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    Submission.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        firmwareVersion: { type: DataTypes.TEXT, allowNull: false },
        sensingSource: { type: DataTypes.TEXT, allowNull: false },
        method: { type: DataTypes.TEXT, allowNull: false },
        voltageScale: { type: DataTypes.DOUBLE, allowNull: true },
        currentScale: { type: DataTypes.DOUBLE, allowNull: true },
        currentOffset: { type: DataTypes.DOUBLE, allowNull: true },
        status: { type: DataTypes.TEXT, allowNull: false, defaultValue: "pending" },
        notes: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        evidenceMismatch: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        evidenceSummary: { type: DataTypes.JSONB, allowNull: true },
        moderatorNote: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      // version: true makes every save check and bump the version column (optimistic locking)
      { sequelize, tableName: "submissions", underscored: true, version: true },
    );
  }
}
