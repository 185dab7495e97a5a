import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { MeasuredAt } from "@/lib/vocabulary";
import type { Submission } from "./Submission";

/** One multimeter reading behind a submission (migrations/20261205000200-…). */
export class SubmissionVoltageReading extends Model<InferAttributes<SubmissionVoltageReading>, InferCreationAttributes<SubmissionVoltageReading>> {
  declare id: CreationOptional<number>;
  declare submissionId: ForeignKey<Submission["id"]>;
  declare position: number;
  declare scaleUsed: number;
  declare cells: number;
  declare reportedVolts: number;
  declare measuredVolts: number;
  declare measuredAt: MeasuredAt;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SubmissionVoltageReading.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        position: { type: DataTypes.SMALLINT, allowNull: false },
        scaleUsed: { type: DataTypes.INTEGER, allowNull: false },
        cells: { type: DataTypes.SMALLINT, allowNull: false },
        reportedVolts: { type: DataTypes.DOUBLE, allowNull: false },
        measuredVolts: { type: DataTypes.DOUBLE, allowNull: false },
        measuredAt: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      // rows are replaced, never updated: no updated_at
      { sequelize, tableName: "submission_voltage_readings", underscored: true, updatedAt: false },
    );
  }
}
