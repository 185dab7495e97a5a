import { DataTypes, Model, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { User } from "./User";

// A session ended by a sign-out (lib/auth/sessions.ts): its JWT's sid, refused from now on.
export class EndedSession extends Model<InferAttributes<EndedSession>, InferCreationAttributes<EndedSession>> {
  declare sid: string;
  declare userId: ForeignKey<User["id"]>;
  declare expiresAt: Date;

  static initModel(sequelize: Sequelize) {
    EndedSession.init(
      {
        sid: { type: DataTypes.UUID, primaryKey: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: "ended_sessions", underscored: true, timestamps: false },
    );
  }
}
