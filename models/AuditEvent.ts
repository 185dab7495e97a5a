import { DataTypes, Model } from "sequelize";
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from "sequelize";
import type { AuditAction, AuditEntityType } from "@/lib/vocabulary";
import type { Submission } from "./Submission";
import type { User } from "./User";

/**
 * One entry of the append-only moderation log (migrations/20261210001100-…; lib/moderation/audit.ts).
 * The table refuses UPDATE and DELETE, so never call save() on a loaded row or destroy().
 */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  /** Null for the system's own actions (auto_approve). */
  declare actorId: ForeignKey<User["id"]> | null;
  declare action: AuditAction;
  declare entityType: AuditEntityType;
  declare submissionId: ForeignKey<Submission["id"]> | null;
  declare targetUserId: ForeignKey<User["id"]> | null;
  declare before: Record<string, unknown>;
  declare after: Record<string, unknown>;
  declare reason: string | null;
  declare revertsEventId: ForeignKey<AuditEvent["id"]> | null;
  declare at: CreationOptional<Date>;

  declare actor?: NonAttribute<User | null>;
  declare submission?: NonAttribute<Submission | null>;
  declare targetUser?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        action: { type: DataTypes.TEXT, allowNull: false },
        entityType: { type: DataTypes.TEXT, allowNull: false },
        before: { type: DataTypes.JSONB, allowNull: false },
        after: { type: DataTypes.JSONB, allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: true },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: "audit_events", underscored: true, timestamps: false },
    );
  }
}
