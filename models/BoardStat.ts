import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ConfidenceLabel, Method, Quantity, ZScaleRule } from "@/lib/vocabulary";
import type { BoardRevision } from "./Board";
import type { FirmwareFamily } from "./FirmwareFamily";

/**
 * The published figures of one quantity of one (revision, firmware family) group
 * (migrations/20261202000900-…). Written only by lib/published's refresh, which recomputes the
 * whole group in PostgreSQL; everything else reads. BoardStatRow is its one row type.
 */
export class BoardStat extends Model<InferAttributes<BoardStat>, InferCreationAttributes<BoardStat>> {
  declare boardRevisionId: ForeignKey<BoardRevision["id"]>;
  declare firmwareFamilyId: ForeignKey<FirmwareFamily["id"]>;
  declare quantity: Quantity;
  declare n: number;
  declare median: number;
  declare q1: number;
  declare q3: number;
  declare iqr: number;
  declare mad: number;
  declare scaledMad: number;
  declare meanAbsDev: number;
  declare ciLow: number | null;
  declare ciHigh: number | null;
  declare ciCoverage: number | null;
  declare ciLowerRank: number | null;
  declare ciUpperRank: number | null;
  declare zScaleRule: ZScaleRule;
  declare outlierCount: number;
  declare tukeyCount: number;
  declare methodCounts: Partial<Record<Method, number>>;
  /** The median rounded to a whole setting step. */
  declare recommendedValue: number;
  declare confidence: ConfidenceLabel;
  /** When the newest approved value of the group last changed. */
  declare lastValueAt: Date;
  declare computedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    const num = () => ({ type: DataTypes.DOUBLE, allowNull: false });
    const nullableNum = () => ({ type: DataTypes.DOUBLE, allowNull: true });
    const int = () => ({ type: DataTypes.INTEGER, allowNull: false });
    BoardStat.init(
      {
        boardRevisionId: { type: DataTypes.INTEGER, primaryKey: true },
        firmwareFamilyId: { type: DataTypes.INTEGER, primaryKey: true },
        quantity: { type: DataTypes.TEXT, primaryKey: true },
        n: int(),
        median: num(),
        q1: num(),
        q3: num(),
        iqr: num(),
        mad: num(),
        scaledMad: num(),
        meanAbsDev: num(),
        ciLow: nullableNum(),
        ciHigh: nullableNum(),
        ciCoverage: nullableNum(),
        ciLowerRank: { type: DataTypes.INTEGER, allowNull: true },
        ciUpperRank: { type: DataTypes.INTEGER, allowNull: true },
        zScaleRule: { type: DataTypes.TEXT, allowNull: false },
        outlierCount: int(),
        tukeyCount: int(),
        methodCounts: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        recommendedValue: num(),
        confidence: { type: DataTypes.TEXT, allowNull: false },
        lastValueAt: { type: DataTypes.DATE, allowNull: false },
        computedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: "board_stats", underscored: true, timestamps: false },
    );
  }
}

/** One board_stats row as plain data: the type every reader and the refresh share. */
export type BoardStatRow = InferAttributes<BoardStat>;
