import { DataTypes, Model } from "sequelize";
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from "sequelize";
import type { StoredType } from "@/lib/vocabulary";
import type { Submission } from "./Submission";
import type { User } from "./User";

export class EvidencePhoto extends Model<InferAttributes<EvidencePhoto>, InferCreationAttributes<EvidencePhoto>> {
  declare id: CreationOptional<string>;
  declare uploaderId: ForeignKey<User["id"]>;
  declare submissionId: ForeignKey<Submission["id"]> | null;
  declare objectKey: string;
  declare contentType: StoredType;
  declare byteSize: number;
  declare width: number;
  declare height: number;
  declare sha256: string;
  declare createdAt: CreationOptional<Date>;
  declare deletedAt: CreationOptional<Date | null>;

  declare uploader?: NonAttribute<User>;
  declare submission?: NonAttribute<Submission | null>;

  static initModel(sequelize: Sequelize) {
    EvidencePhoto.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        objectKey: { type: DataTypes.TEXT, allowNull: false },
        contentType: { type: DataTypes.TEXT, allowNull: false },
        byteSize: { type: DataTypes.INTEGER, allowNull: false },
        width: { type: DataTypes.INTEGER, allowNull: false },
        height: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        deletedAt: DataTypes.DATE,
      },
      // paranoid: destroy() sets deleted_at and every query skips removed photos unless it asks
      // for them with paranoid: false (moderators' view); a photo row is never hard-deleted.
      { sequelize, tableName: "evidence_photos", underscored: true, updatedAt: false, paranoid: true },
    );
  }
}
