import { DataTypes, fn, Model } from "sequelize";
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from "sequelize";
import type { BoardKind, CurrentSensorKind } from "@/lib/vocabulary";
import type { Manufacturer } from "./Manufacturer";

// A board model with its revisions and the other names it is sold under, in one file because each
// side of these associations names the other's type.

export class BoardModel extends Model<InferAttributes<BoardModel>, InferCreationAttributes<BoardModel>> {
  declare id: CreationOptional<number>;
  declare manufacturerId: ForeignKey<Manufacturer["id"]>;
  declare slug: string;
  declare name: string;
  declare kind: BoardKind;
  declare mountingPattern: string;
  declare minCells: CreationOptional<number>;
  declare maxCells: number;
  declare description: string | null;
  /**
   * The id of the transaction that last changed this board's published values (xid8, as text):
   * written by the database (its default, triggers) and by lib/published refreshGroups, never by
   * hand. The values cache's stamp; see migrations/20261212001000-add-values-version-to-board-models.ts.
   */
  declare valuesVersion: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare manufacturer?: NonAttribute<Manufacturer>;
  declare revisions?: NonAttribute<BoardRevision[]>;
  declare aliases?: NonAttribute<BoardAlias[]>;

  static initModel(sequelize: Sequelize) {
    BoardModel.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        slug: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        kind: { type: DataTypes.TEXT, allowNull: false },
        mountingPattern: { type: DataTypes.TEXT, allowNull: false },
        minCells: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 1 },
        maxCells: { type: DataTypes.SMALLINT, allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: true },
        valuesVersion: { type: "xid8", allowNull: false, defaultValue: fn("pg_current_xact_id") },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "board_models", underscored: true },
    );
  }
}

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

export class BoardAlias extends Model<InferAttributes<BoardAlias>, InferCreationAttributes<BoardAlias>> {
  declare id: CreationOptional<number>;
  declare boardModelId: ForeignKey<BoardModel["id"]>;
  declare alias: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    BoardAlias.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        alias: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "board_aliases", underscored: true },
    );
  }
}
