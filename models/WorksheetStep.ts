import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Worksheet } from "./Worksheet";

/** One fly-and-recharge iteration of a worksheet (migrations/20261211000200-…). */
export class WorksheetStep extends Model<InferAttributes<WorksheetStep>, InferCreationAttributes<WorksheetStep>> {
  declare id: CreationOptional<number>;
  declare worksheetId: ForeignKey<Worksheet["id"]>;
  declare position: number;
  declare scaleUsed: number;
  declare reportedMah: number;
  declare chargedMah: number;
  declare fullyRecharged: CreationOptional<boolean>;
  /** Set when the builder took the iteration back: kept, shown struck out, never counted (migrations/20261212002000-…). */
  declare removedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    WorksheetStep.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        position: { type: DataTypes.SMALLINT, allowNull: false },
        scaleUsed: { type: DataTypes.INTEGER, allowNull: false },
        reportedMah: { type: DataTypes.DOUBLE, allowNull: false },
        chargedMah: { type: DataTypes.DOUBLE, allowNull: false },
        fullyRecharged: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        removedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "worksheet_steps", underscored: true, updatedAt: false },
    );
  }
}
