import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Chemistry } from "@/lib/vocabulary";
import type { User } from "./User";

/** A flight pack in a builder's garage (migrations/20261209000200-…). */
export class Pack extends Model<InferAttributes<Pack>, InferCreationAttributes<Pack>> {
  declare id: CreationOptional<number>;
  declare ownerId: ForeignKey<User["id"]>;
  declare label: string;
  declare chemistry: Chemistry;
  declare cells: number;
  declare ratedMah: number;
  /** A DATEONLY: "YYYY-MM-DD". */
  declare purchasedOn: string | null;
  /** Set when a delete found a published worksheet behind the row (migrations/20261215006100-…): hidden, kept. */
  declare archivedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Pack.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        label: { type: DataTypes.STRING(80), allowNull: false },
        chemistry: { type: DataTypes.STRING(8), allowNull: false },
        cells: { type: DataTypes.SMALLINT, allowNull: false },
        ratedMah: { type: DataTypes.INTEGER, allowNull: false },
        purchasedOn: { type: DataTypes.DATEONLY, allowNull: true },
        archivedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "packs", underscored: true },
    );
  }
}
