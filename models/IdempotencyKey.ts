import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Submission } from "./Submission";
import type { User } from "./User";

/** A stored first response to an Idempotency-Key (migrations/20261205000500-…; lib/submissions/idempotency.ts). */
export class IdempotencyKey extends Model<InferAttributes<IdempotencyKey>, InferCreationAttributes<IdempotencyKey>> {
  declare userId: ForeignKey<User["id"]>;
  declare key: string;
  declare requestHash: string;
  declare responseStatus: number;
  declare responseBody: unknown;
  declare submissionId: ForeignKey<Submission["id"]> | null;
  declare createdAt: CreationOptional<Date>;
  declare expiresAt: Date;

  static initModel(sequelize: Sequelize) {
    IdempotencyKey.init(
      {
        userId: { type: DataTypes.UUID, primaryKey: true },
        key: { type: DataTypes.TEXT, primaryKey: true },
        requestHash: { type: DataTypes.TEXT, allowNull: false },
        responseStatus: { type: DataTypes.SMALLINT, allowNull: false },
        responseBody: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
        expiresAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: "idempotency_keys", underscored: true, updatedAt: false },
    );
  }
}
