import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { BoardModel } from "./BoardModel";

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
