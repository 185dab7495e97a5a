import { DataTypes, Model } from "sequelize";
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from "sequelize";
import type { ConfidenceLabel, Quantity } from "@/lib/vocabulary";
import type { AuditEvent } from "./AuditEvent";
import type { BoardRevision } from "./Board";
import type { FirmwareFamily } from "./FirmwareFamily";

/**
 * One published value after a change (migrations/20261210001200-…; lib/published/history.ts).
 * Append-only; n = 0 with nulls means the quantity stopped being published.
 */
export class PublishedValueHistory extends Model<InferAttributes<PublishedValueHistory>, InferCreationAttributes<PublishedValueHistory>> {
  declare id: CreationOptional<number>;
  declare boardRevisionId: ForeignKey<BoardRevision["id"]>;
  declare firmwareFamilyId: ForeignKey<FirmwareFamily["id"]>;
  declare quantity: Quantity;
  declare recommendedValue: number | null;
  declare n: number;
  declare median: number | null;
  declare ciLow: number | null;
  declare ciHigh: number | null;
  declare confidence: ConfidenceLabel | null;
  declare at: CreationOptional<Date>;
  /** Null for a baseline row (what was published before the first recorded change). */
  declare causedByEventId: ForeignKey<AuditEvent["id"]> | null;

  declare causedBy?: NonAttribute<AuditEvent | null>;

  static initModel(sequelize: Sequelize) {
    PublishedValueHistory.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        quantity: { type: DataTypes.TEXT, allowNull: false },
        recommendedValue: { type: DataTypes.DOUBLE, allowNull: true },
        n: { type: DataTypes.INTEGER, allowNull: false },
        median: { type: DataTypes.DOUBLE, allowNull: true },
        ciLow: { type: DataTypes.DOUBLE, allowNull: true },
        ciHigh: { type: DataTypes.DOUBLE, allowNull: true },
        confidence: { type: DataTypes.TEXT, allowNull: true },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: "published_value_history", underscored: true, timestamps: false },
    );
  }
}
