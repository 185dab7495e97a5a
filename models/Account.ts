import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { User } from "./User";

// next-auth's Account, attribute names as @next-auth/sequelize-adapter uses them (snake_case
// token fields are next-auth's own names). Only the adapter reads and writes it.
export class Account extends Model<InferAttributes<Account>, InferCreationAttributes<Account>> {
  declare id: CreationOptional<string>;
  declare userId: ForeignKey<User["id"]>;
  declare type: string;
  declare provider: string;
  declare providerAccountId: string;
  declare refresh_token: string | null;
  declare access_token: string | null;
  declare expires_at: number | null;
  declare token_type: string | null;
  declare scope: string | null;
  declare id_token: string | null;
  declare session_state: string | null;

  static initModel(sequelize: Sequelize) {
    const text = { type: DataTypes.TEXT, allowNull: true };
    Account.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        type: { type: DataTypes.TEXT, allowNull: false },
        provider: { type: DataTypes.TEXT, allowNull: false },
        providerAccountId: { type: DataTypes.TEXT, allowNull: false },
        refresh_token: text,
        access_token: text,
        expires_at: { type: DataTypes.INTEGER, allowNull: true },
        token_type: text,
        scope: text,
        id_token: text,
        session_state: text,
      },
      // created_at has a database default; the adapter's models carry no timestamps
      { sequelize, tableName: "accounts", underscored: true, timestamps: false },
    );
  }
}
