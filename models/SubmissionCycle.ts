import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Submission } from "./Submission";

/** One fly-and-recharge cycle behind a submission (migrations/20261205000300-…). */
export class SubmissionCycle extends Model<InferAttributes<SubmissionCycle>, InferCreationAttributes<SubmissionCycle>> {
  declare id: CreationOptional<number>;
  declare submissionId: ForeignKey<Submission["id"]>;
  declare position: number;
  declare scaleUsed: number;
  declare reportedMah: number;
  declare chargedMah: number;
  declare ratedMah: number;
  declare cells: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SubmissionCycle.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        position: { type: DataTypes.SMALLINT, allowNull: false },
        scaleUsed: { type: DataTypes.INTEGER, allowNull: false },
        reportedMah: { type: DataTypes.DOUBLE, allowNull: false },
        chargedMah: { type: DataTypes.DOUBLE, allowNull: false },
        ratedMah: { type: DataTypes.DOUBLE, allowNull: false },
        cells: { type: DataTypes.SMALLINT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "submission_cycles", underscored: true, updatedAt: false },
    );
  }
}
