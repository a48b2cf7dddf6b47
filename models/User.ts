import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import { ROLES, type Role } from "../lib/auth/roles";

/** A person who signs in: consignor, dealer, mediator and/or house admin. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>;
  declare email: string;
  declare displayName: string;
  declare passwordHash: string;
  declare roles: Role[];
  declare disabledAt: CreationOptional<Date | null>;
  /** Bumped on sign-out and password change; a JWT carrying an older one no longer signs anyone in. */
  declare sessionVersion: CreationOptional<number>;
  /** Null until a self-service account opens the link e-mailed at sign-up; such an account cannot sign in. */
  declare emailConfirmedAt: CreationOptional<Date | null>;
  /** SHA-256 of the latest confirmation link's token, and when that link stops working. */
  declare confirmTokenHash: CreationOptional<string | null>;
  declare confirmExpiresAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  hasRole(role: Role): boolean {
    return this.roles.includes(role);
  }

  static initModel(sequelize: Sequelize): typeof User {
    User.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        email: {
          type: DataTypes.STRING(254),
          allowNull: false,
          unique: true,
          set(v: string) {
            this.setDataValue("email", v.trim().toLowerCase());
          },
        },
        displayName: { type: DataTypes.STRING(80), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        roles: {
          type: DataTypes.ARRAY(DataTypes.STRING(16)),
          allowNull: false,
          defaultValue: [],
          validate: {
            known(v: string[]) {
              for (const r of v) if (!(ROLES as readonly string[]).includes(r)) throw new Error(`unknown role ${r}`);
            },
          },
        },
        disabledAt: { type: DataTypes.DATE, allowNull: true },
        sessionVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        emailConfirmedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: DataTypes.NOW },
        confirmTokenHash: { type: DataTypes.STRING(64), allowNull: true, unique: true },
        confirmExpiresAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "users", modelName: "User" },
    );
    return User;
  }
}
