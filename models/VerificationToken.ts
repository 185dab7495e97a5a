import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

// next-auth's magic-link tokens (hashed by next-auth before they reach us); only the adapter uses it.
export class VerificationToken extends Model<InferAttributes<VerificationToken>, InferCreationAttributes<VerificationToken>> {
  declare token: string;
  declare identifier: string;
  declare expires: Date;

  static initModel(sequelize: Sequelize) {
    VerificationToken.init(
      {
        token: { type: DataTypes.TEXT, primaryKey: true },
        identifier: { type: DataTypes.TEXT, allowNull: false },
        expires: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: "verification_tokens", underscored: true, timestamps: false },
    );
  }
}
