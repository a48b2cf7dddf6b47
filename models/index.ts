import type { Sequelize } from "sequelize";
import { getSequelize } from "../lib/db/sequelize";
import { PasswordResetToken } from "./PasswordResetToken";
import { SignInAttempt } from "./SignInAttempt";
import { User } from "./User";

// Module-local on purpose: the custom server and Next's bundle each hold their
// own copies of the model classes, and each copy must be initialised.
let initialisedFor: Sequelize | undefined;

/** Initialise every model on the shared Sequelize instance (once per instance). */
export function initModels(sequelize: Sequelize = getSequelize()): Sequelize {
  if (initialisedFor === sequelize) return sequelize;
  User.initModel(sequelize);
  SignInAttempt.initModel(sequelize);
  PasswordResetToken.initModel(sequelize);
  User.hasMany(PasswordResetToken, { foreignKey: "userId", onDelete: "CASCADE" });
  PasswordResetToken.belongsTo(User, { foreignKey: "userId" });
  initialisedFor = sequelize;
  return sequelize;
}

/** The shared instance with models ready; call at the top of every service. */
export function db(): Sequelize {
  return initModels(getSequelize());
}

export { PasswordResetToken, SignInAttempt, User };
