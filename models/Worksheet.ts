import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { WorksheetKind } from "@/lib/vocabulary";
import type { FirmwareFamily } from "./FirmwareFamily";
import type { Pack } from "./Pack";
import type { Quad } from "./Quad";
import type { Submission } from "./Submission";
import type { User } from "./User";

/**
 * A calibration worksheet on a builder's quad (migrations/20261211000100-…, 20261212000100-…).
 * ratedMah and cells are set for fly_recharge only; startingOffset for bench only.
 */
export class Worksheet extends Model<InferAttributes<Worksheet>, InferCreationAttributes<Worksheet>> {
  declare id: CreationOptional<number>;
  declare ownerId: ForeignKey<User["id"]>;
  declare quadId: ForeignKey<Quad["id"]>;
  declare kind: WorksheetKind;
  declare firmwareFamilyId: ForeignKey<FirmwareFamily["id"]>;
  declare ratedMah: number | null;
  declare cells: number | null;
  declare startingScale: number;
  declare startingOffset: CreationOptional<number | null>;
  declare startingSource: "published" | "own";
  /** The garage pack a fly-and-recharge worksheet was started from, if any (migrations/20261215006100-…). */
  declare packId: CreationOptional<ForeignKey<Pack["id"]> | null>;
  declare submissionId: ForeignKey<Submission["id"]> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Worksheet.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        ratedMah: { type: DataTypes.INTEGER, allowNull: true },
        cells: { type: DataTypes.SMALLINT, allowNull: true },
        startingScale: { type: DataTypes.INTEGER, allowNull: false },
        startingOffset: { type: DataTypes.INTEGER, allowNull: true },
        startingSource: { type: DataTypes.STRING(16), allowNull: false },
        packId: { type: DataTypes.INTEGER, allowNull: true },
        submissionId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "worksheets", underscored: true },
    );
  }
}
