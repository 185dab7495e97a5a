import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { User } from "./User";

// next-auth's database Session (table sessions). Named AuthSession so that it is not mistaken for
// the JWT session the app actually uses (see lib/auth/options.ts); only the adapter touches it.
export class AuthSession extends Model<InferAttributes<AuthSession>, InferCreationAttributes<AuthSession>> {
  declare id: CreationOptional<string>;
  declare sessionToken: string;
  declare userId: ForeignKey<User["id"]>;
  declare expires: Date;

  static initModel(sequelize: Sequelize) {
    AuthSession.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        sessionToken: { type: DataTypes.TEXT, allowNull: false },
        expires: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: "sessions", underscored: true, timestamps: false },
    );
  }
}
