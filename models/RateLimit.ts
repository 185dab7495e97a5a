import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

// A rate-limiter-flexible counter (lib/auth/rate-limit.ts). The library reads and writes the
// table with its own SQL; the model is for tests and for clearing a key by hand.
export class RateLimit extends Model<InferAttributes<RateLimit>, InferCreationAttributes<RateLimit>> {
  declare key: string;
  declare points: number;
  /** Epoch milliseconds when the window ends. */
  declare expire: number | null;

  static initModel(sequelize: Sequelize) {
    RateLimit.init(
      {
        key: { type: DataTypes.STRING(255), primaryKey: true },
        points: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        expire: { type: DataTypes.BIGINT, allowNull: true },
      },
      { sequelize, tableName: "rate_limits", timestamps: false },
    );
  }
}
