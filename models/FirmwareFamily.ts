import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import type { CurrentOffsetUnit, CurrentScaleUnit, Response, VoltageScaleUnit } from "@/lib/vocabulary";

/** The unit definition of one firmware family: see the migration for what each column means. */
export class FirmwareFamily extends Model<InferAttributes<FirmwareFamily>, InferCreationAttributes<FirmwareFamily>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare name: string;
  declare description: string | null;
  declare voltageScaleUnit: VoltageScaleUnit;
  declare voltageScaleStep: number;
  declare voltageScaleResponse: Response;
  declare voltageScaleMin: number;
  declare voltageScaleMax: number;
  declare currentScaleUnit: CurrentScaleUnit;
  declare currentScaleStep: number;
  declare currentScaleResponse: Response;
  declare currentScaleMin: number;
  declare currentScaleMax: number;
  declare currentOffsetUnit: CurrentOffsetUnit;
  declare currentOffsetStep: number;
  declare currentOffsetMin: number;
  declare currentOffsetMax: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    // fresh objects per attribute: Sequelize writes each attribute's column name into its
    // definition, so one shared object would map every column onto the first one's
    const num = () => ({ type: DataTypes.DOUBLE, allowNull: false });
    const text = () => ({ type: DataTypes.TEXT, allowNull: false });
    FirmwareFamily.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        slug: text(),
        name: text(),
        description: { type: DataTypes.TEXT, allowNull: true },
        voltageScaleUnit: text(),
        voltageScaleStep: num(),
        voltageScaleResponse: text(),
        voltageScaleMin: num(),
        voltageScaleMax: num(),
        currentScaleUnit: text(),
        currentScaleStep: num(),
        currentScaleResponse: text(),
        currentScaleMin: num(),
        currentScaleMax: num(),
        currentOffsetUnit: text(),
        currentOffsetStep: num(),
        currentOffsetMin: num(),
        currentOffsetMax: num(),
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "firmware_families", underscored: true },
    );
  }
}

/**
 * The unit fields of a firmware family, in column order: how each setting is counted (unit, step,
 * response) and the range a setting may take. FamilyUnitFields is their one TypeScript type,
 * FAMILY_UNIT_COLUMNS / familyUnitColumnsSql their one SQL column list.
 */
const FAMILY_UNIT_FIELDS = [
  "voltageScaleUnit",
  "voltageScaleStep",
  "voltageScaleResponse",
  "voltageScaleMin",
  "voltageScaleMax",
  "currentScaleUnit",
  "currentScaleStep",
  "currentScaleResponse",
  "currentScaleMin",
  "currentScaleMax",
  "currentOffsetUnit",
  "currentOffsetStep",
  "currentOffsetMin",
  "currentOffsetMax",
] as const satisfies readonly (keyof InferAttributes<FirmwareFamily>)[];

export type FamilyUnitFields = Pick<InferAttributes<FirmwareFamily>, (typeof FAMILY_UNIT_FIELDS)[number]>;

/** The same fields as firmware_families column names (the underscored naming of the model). */
export const FAMILY_UNIT_COLUMNS = FAMILY_UNIT_FIELDS.map((field) => field.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`));

/** `column AS "field"` for each unit field, for a raw SELECT; `table` is an optional alias prefix. */
export function familyUnitColumnsSql(table?: string): string {
  return FAMILY_UNIT_FIELDS.map((field, i) => `${table ? `${table}.` : ""}${FAMILY_UNIT_COLUMNS[i]} AS "${field}"`).join(", ");
}

/** Just the unit fields of a family (a model instance or a plain row), as plain data. */
export function familyUnitFieldsOf(family: FamilyUnitFields): FamilyUnitFields {
  return Object.fromEntries(FAMILY_UNIT_FIELDS.map((field) => [field, family[field]])) as FamilyUnitFields;
}
