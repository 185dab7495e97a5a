import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import type { Role } from "@/lib/vocabulary";

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare email: string;
  declare emailVerified: Date | null;
  declare image: string | null;
  declare passwordHash: string | null;
  declare role: CreationOptional<Role>;
  /** Sessions from before this moment are refused by the guard (lib/auth/guard.ts). */
  declare passwordChangedAt: CreationOptional<Date | null>;
  /** Sessions whose JWT carries another number are refused; sign-out adds one (lib/auth/sessions.ts). */
  declare sessionVersion: CreationOptional<number>;
  /** An admin's word on auto-approval: true trusted regardless, false never, null by the record (lib/moderation/trust.ts). */
  declare trusted: CreationOptional<boolean | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        name: { type: DataTypes.TEXT, allowNull: false },
        email: { type: DataTypes.TEXT, allowNull: false },
        emailVerified: { type: DataTypes.DATE, allowNull: true },
        image: { type: DataTypes.TEXT, allowNull: true },
        passwordHash: { type: DataTypes.TEXT, allowNull: true },
        role: { type: DataTypes.TEXT, allowNull: false, defaultValue: "contributor" },
        passwordChangedAt: { type: DataTypes.DATE, allowNull: true },
        sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        trusted: { type: DataTypes.BOOLEAN, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: "users",
        underscored: true,
        // never hand the hash to a page or an API response by accident
        defaultScope: { attributes: { exclude: ["passwordHash"] } },
        scopes: { withPassword: { attributes: { include: ["passwordHash"] } } },
      },
    );
  }
}
