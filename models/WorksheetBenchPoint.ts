import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Worksheet } from "./Worksheet";

/** One clamp-meter point of a bench worksheet (migrations/20261212000300-…); removedAt set = withdrawn, kept. */
export class WorksheetBenchPoint extends Model<InferAttributes<WorksheetBenchPoint>, InferCreationAttributes<WorksheetBenchPoint>> {
  declare id: CreationOptional<number>;
  declare worksheetId: ForeignKey<Worksheet["id"]>;
  declare position: number;
  declare measuredAmps: number;
  declare reportedAmps: number;
  declare removedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    WorksheetBenchPoint.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        position: { type: DataTypes.SMALLINT, allowNull: false },
        measuredAmps: { type: DataTypes.DOUBLE, allowNull: false },
        reportedAmps: { type: DataTypes.DOUBLE, allowNull: false },
        removedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "worksheet_bench_points", underscored: true, updatedAt: false },
    );
  }
}
