import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { FirmwareFamily } from "./FirmwareFamily";
import type { Quad } from "./Quad";
import type { Submission } from "./Submission";
import type { User } from "./User";

/** A calibration worksheet on a builder's quad (migrations/20261211000100-…). */
export class Worksheet extends Model<InferAttributes<Worksheet>, InferCreationAttributes<Worksheet>> {
  declare id: CreationOptional<number>;
  declare ownerId: ForeignKey<User["id"]>;
  declare quadId: ForeignKey<Quad["id"]>;
  declare kind: "fly_recharge";
  declare firmwareFamilyId: ForeignKey<FirmwareFamily["id"]>;
  declare ratedMah: number;
  declare cells: number;
  declare startingScale: number;
  declare startingSource: "published" | "own";
  declare submissionId: ForeignKey<Submission["id"]> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Worksheet.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        ratedMah: { type: DataTypes.INTEGER, allowNull: false },
        cells: { type: DataTypes.SMALLINT, allowNull: false },
        startingScale: { type: DataTypes.INTEGER, allowNull: false },
        startingSource: { type: DataTypes.STRING(16), allowNull: false },
        submissionId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "worksheets", underscored: true },
    );
  }
}
