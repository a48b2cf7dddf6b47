import {
  DataTypes,
  Model,
  Op,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** One sign-in try, kept for rate limiting across app instances. */
export class SignInAttempt extends Model<InferAttributes<SignInAttempt>, InferCreationAttributes<SignInAttempt>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare ip: string;
  declare succeeded: boolean;
  declare createdAt: CreationOptional<Date>;

  /** Failed attempts since `since` for an account and for an address. */
  static async recentFailures(
    email: string,
    ip: string,
    since: Date,
  ): Promise<{ byAccount: number; byAddress: number }> {
    const [byAccount, byAddress] = await Promise.all([
      SignInAttempt.count({ where: { email, succeeded: false, createdAt: { [Op.gte]: since } } }),
      SignInAttempt.count({ where: { ip, succeeded: false, createdAt: { [Op.gte]: since } } }),
    ]);
    return { byAccount, byAddress };
  }

  static initModel(sequelize: Sequelize): typeof SignInAttempt {
    SignInAttempt.init(
      {
        id: {
          type: DataTypes.BIGINT,
          autoIncrement: true,
          primaryKey: true,
          get() {
            return Number(this.getDataValue("id"));
          },
        },
        email: { type: DataTypes.STRING(254), allowNull: false },
        ip: { type: DataTypes.STRING(64), allowNull: false },
        succeeded: { type: DataTypes.BOOLEAN, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "sign_in_attempts", modelName: "SignInAttempt", updatedAt: false },
    );
    return SignInAttempt;
  }
}
