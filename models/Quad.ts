import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { BoardRevision } from "./Board";
import type { FirmwareFamily } from "./FirmwareFamily";
import type { User } from "./User";

/** A quad in a builder's garage (migrations/20261209000100-…); only its owner sees it. */
export class Quad extends Model<InferAttributes<Quad>, InferCreationAttributes<Quad>> {
  declare id: CreationOptional<number>;
  declare ownerId: ForeignKey<User["id"]>;
  declare name: string;
  declare boardRevisionId: ForeignKey<BoardRevision["id"]> | null;
  declare firmwareFamilyId: ForeignKey<FirmwareFamily["id"]> | null;
  declare firmwareVersion: string | null;
  declare esc: string | null;
  declare notes: string | null;
  /** Set when a delete found a published worksheet behind the row (migrations/20261215006100-…): hidden, kept. */
  declare archivedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Quad.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        name: { type: DataTypes.STRING(80), allowNull: false },
        firmwareVersion: { type: DataTypes.STRING(40), allowNull: true },
        esc: { type: DataTypes.STRING(120), allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "quads", underscored: true },
    );
  }
}
