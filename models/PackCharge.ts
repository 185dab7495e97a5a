import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Pack } from "./Pack";

/** One charge in a pack's log (migrations/20261209000300-…). */
export class PackCharge extends Model<InferAttributes<PackCharge>, InferCreationAttributes<PackCharge>> {
  declare id: CreationOptional<number>;
  declare packId: ForeignKey<Pack["id"]>;
  /** A DATEONLY: "YYYY-MM-DD". */
  declare chargedOn: string;
  declare chargedMah: number;
  declare restingVoltsPerCell: number | null;
  declare afterFullFlight: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PackCharge.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        chargedOn: { type: DataTypes.DATEONLY, allowNull: false },
        chargedMah: { type: DataTypes.DOUBLE, allowNull: false },
        restingVoltsPerCell: { type: DataTypes.DOUBLE, allowNull: true },
        afterFullFlight: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "pack_charges", underscored: true, updatedAt: false },
    );
  }
}
