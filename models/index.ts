import type { Sequelize } from "sequelize";
import { getSequelize } from "../lib/db/sequelize";
import { HouseSettingsVersion, UserAddress } from "./HouseSettings";
import { Lot } from "./Lot";
import { LotEvent, LotImport } from "./LotEvent";
import { LotItem } from "./LotItem";
import { LotPhoto } from "./LotPhoto";
import { Maker, MakerCode } from "./Maker";
import { PasswordResetToken } from "./PasswordResetToken";
import { Notice, Sale, SaleLot } from "./Sale";
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
  Lot.initModel(sequelize);
  LotItem.initModel(sequelize);
  LotPhoto.initModel(sequelize);
  LotEvent.initModel(sequelize);
  LotImport.initModel(sequelize);
  Lot.belongsTo(User, { foreignKey: "consignorId", as: "consignor" });
  Lot.hasMany(LotItem, { foreignKey: "lotId", as: "items" });
  LotItem.belongsTo(Lot, { foreignKey: "lotId" });
  Lot.hasMany(LotPhoto, { foreignKey: "lotId", as: "photos" });
  Lot.hasMany(LotEvent, { foreignKey: "lotId", as: "events" });
  LotEvent.belongsTo(User, { foreignKey: "actorId", as: "actor" });
  Sale.initModel(sequelize);
  SaleLot.initModel(sequelize);
  Notice.initModel(sequelize);
  Sale.hasMany(SaleLot, { foreignKey: "saleId", as: "saleLots" });
  SaleLot.belongsTo(Sale, { foreignKey: "saleId", as: "sale" });
  SaleLot.belongsTo(Lot, { foreignKey: "lotId", as: "lot" });
  HouseSettingsVersion.initModel(sequelize);
  UserAddress.initModel(sequelize);
  initialisedFor = sequelize;
  return sequelize;
}

/** The shared instance with models ready; call at the top of every service. */
export function db(): Sequelize {
  return initModels(getSequelize());
}

export { HouseSettingsVersion, Notice, Sale, SaleLot, UserAddress };
export {
  Lot,
  LotEvent,
  LotImport,
  LotItem,
  LotPhoto,
  Maker,
  MakerCode,
  PasswordResetToken,
  ShelfTube,
  SignInAttempt,
  User,
  ValveType,
  ValveTypeRevision,
};
