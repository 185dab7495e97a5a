import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Submission } from "./Submission";

/** One bench point (display amps against clamp-meter amps) behind a submission (migrations/20261205000400-…). */
export class SubmissionBenchPoint extends Model<InferAttributes<SubmissionBenchPoint>, InferCreationAttributes<SubmissionBenchPoint>> {
  declare id: CreationOptional<number>;
  declare submissionId: ForeignKey<Submission["id"]>;
  declare position: number;
  declare scaleUsed: number;
  declare offsetUsed: number;
  declare reportedAmps: number;
  declare measuredAmps: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SubmissionBenchPoint.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        position: { type: DataTypes.SMALLINT, allowNull: false },
        scaleUsed: { type: DataTypes.INTEGER, allowNull: false },
        offsetUsed: { type: DataTypes.INTEGER, allowNull: false },
        reportedAmps: { type: DataTypes.DOUBLE, allowNull: false },
        measuredAmps: { type: DataTypes.DOUBLE, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "submission_bench_points", underscored: true, updatedAt: false },
    );
  }
}
