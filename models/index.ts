import type { Sequelize } from "sequelize";
import { getSequelize } from "../lib/db/sequelize";
import { PasswordResetToken } from "./PasswordResetToken";
import { SignInAttempt } from "./SignInAttempt";
import { User } from "./User";

const g = globalThis as unknown as { __getterlineModelsFor?: Sequelize };

/** Initialise every model on the shared Sequelize instance (once per instance). */
export function initModels(sequelize: Sequelize = getSequelize()): Sequelize {
  if (g.__getterlineModelsFor === sequelize) return sequelize;
  User.initModel(sequelize);
  SignInAttempt.initModel(sequelize);
  PasswordResetToken.initModel(sequelize);
  User.hasMany(PasswordResetToken, { foreignKey: "userId", onDelete: "CASCADE" });
  PasswordResetToken.belongsTo(User, { foreignKey: "userId" });
  g.__getterlineModelsFor = sequelize;
  return sequelize;
}

/** The shared instance with models ready; call at the top of every service. */
export function db(): Sequelize {
  return initModels(getSequelize());
}

export { PasswordResetToken, SignInAttempt, User };
