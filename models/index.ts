import type { Sequelize } from "sequelize";
import { getSequelize } from "../lib/db/sequelize";
import { Maker, MakerCode } from "./Maker";
import { PasswordResetToken } from "./PasswordResetToken";
import { ShelfTube } from "./ShelfTube";
import { ValveType, ValveTypeRevision } from "./ValveType";
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
  ValveType.initModel(sequelize);
  ValveTypeRevision.initModel(sequelize);
  Maker.initModel(sequelize);
  MakerCode.initModel(sequelize);
  ShelfTube.initModel(sequelize);
  Maker.hasMany(MakerCode, { foreignKey: "makerId", as: "codes" });
  MakerCode.belongsTo(Maker, { foreignKey: "makerId", as: "maker" });
  ShelfTube.belongsTo(Maker, { foreignKey: "makerId", as: "maker" });
  ShelfTube.belongsTo(User, { foreignKey: "ownerId", as: "owner" });
  ValveTypeRevision.belongsTo(User, { foreignKey: "changedBy", as: "changer" });
  initialisedFor = sequelize;
  return sequelize;
}

/** The shared instance with models ready; call at the top of every service. */
export function db(): Sequelize {
  return initModels(getSequelize());
}

export { Maker, MakerCode, PasswordResetToken, ShelfTube, SignInAttempt, User, ValveType, ValveTypeRevision };
