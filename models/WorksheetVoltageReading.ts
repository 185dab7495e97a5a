import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { MeasuredAt } from "@/lib/vocabulary";
import type { Worksheet } from "./Worksheet";

/** One display/multimeter pair of a voltage worksheet (migrations/20261212000200-…); removedAt set = withdrawn, kept. */
export class WorksheetVoltageReading extends Model<InferAttributes<WorksheetVoltageReading>, InferCreationAttributes<WorksheetVoltageReading>> {
  declare id: CreationOptional<number>;
  declare worksheetId: ForeignKey<Worksheet["id"]>;
  declare position: number;
  declare cells: number;
  declare reportedVolts: number;
  declare measuredVolts: number;
  declare measuredAt: MeasuredAt;
  declare removedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    WorksheetVoltageReading.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        position: { type: DataTypes.SMALLINT, allowNull: false },
        cells: { type: DataTypes.SMALLINT, allowNull: false },
        reportedVolts: { type: DataTypes.DOUBLE, allowNull: false },
        measuredVolts: { type: DataTypes.DOUBLE, allowNull: false },
        measuredAt: { type: DataTypes.TEXT, allowNull: false },
        removedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "worksheet_voltage_readings", underscored: true, updatedAt: false },
    );
  }
}
