import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { CurrentSensorKind } from "@/lib/vocabulary";
import type { BoardModel } from "./BoardModel";


export class BoardRevision extends Model<InferAttributes<BoardRevision>, InferCreationAttributes<BoardRevision>> {
  declare id: CreationOptional<number>;
  declare boardModelId: ForeignKey<BoardModel["id"]>;
  declare label: string;
  declare position: CreationOptional<number>;
  declare releasedOn: string | null;
  declare dividerTopOhms: number | null;
  declare dividerBottomOhms: number | null;
  declare currentSensor: CurrentSensorKind | null;
  declare shuntMilliohms: number | null;
  declare amplifierGain: number | null;
  declare hallMvPerAmp: number | null;
  declare adcBits: number | null;
  declare adcReferenceVolts: number | null;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare boardModel?: NonAttribute<BoardModel>;

  static initModel(sequelize: Sequelize) {
    BoardRevision.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        label: { type: DataTypes.TEXT, allowNull: false },
        position: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 0 },
        releasedOn: { type: DataTypes.DATEONLY, allowNull: true },
        dividerTopOhms: { type: DataTypes.DOUBLE, allowNull: true },
        dividerBottomOhms: { type: DataTypes.DOUBLE, allowNull: true },
        currentSensor: { type: DataTypes.TEXT, allowNull: true },
        shuntMilliohms: { type: DataTypes.DOUBLE, allowNull: true },
        amplifierGain: { type: DataTypes.DOUBLE, allowNull: true },
        hallMvPerAmp: { type: DataTypes.DOUBLE, allowNull: true, field: "hall_mv_per_amp" },
        adcBits: { type: DataTypes.SMALLINT, allowNull: true },
        adcReferenceVolts: { type: DataTypes.DOUBLE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "board_revisions", underscored: true },
    );
  }
}
