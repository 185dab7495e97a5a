import { DataTypes, fn, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { BoardKind } from "@/lib/vocabulary";
import type { BoardAlias } from "./BoardAlias";
import type { BoardRevision } from "./BoardRevision";
import type { Manufacturer } from "./Manufacturer";


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
