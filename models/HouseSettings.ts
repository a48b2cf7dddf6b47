import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { HouseSettings } from "../lib/validation/house-settings";
import type { Address } from "../lib/validation/address";

/** One version of the house settings: never updated; a change is a new row with who, when and why. */
export class HouseSettingsVersion extends Model<
  InferAttributes<HouseSettingsVersion>,
  InferCreationAttributes<HouseSettingsVersion>
> {
  declare version: number;
  declare settings: HouseSettings;
  declare reason: string;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof HouseSettingsVersion {
    HouseSettingsVersion.init(
      {
        version: { type: DataTypes.INTEGER, primaryKey: true },
        settings: { type: DataTypes.JSONB, allowNull: false },
        reason: { type: DataTypes.STRING(500), allowNull: false },
        createdBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "house_settings_versions", modelName: "HouseSettingsVersion", updatedAt: false },
    );
    return HouseSettingsVersion;
  }
}

/** A person's shipping address (one per person): where a buyer's lots go and a consignor's lots leave from. */
export class UserAddress extends Model<InferAttributes<UserAddress>, InferCreationAttributes<UserAddress>> {
  declare userId: string;
  declare name: string;
  declare line1: string;
  declare line2: string;
  declare city: string;
  declare region: string;
  declare postalCode: string;
  declare country: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** The address as plain validated data. */
  toAddress(): Address {
    const { name, line1, line2, city, region, postalCode, country } = this;
    return { name, line1, line2, city, region, postalCode, country: country.trim() };
  }

  static initModel(sequelize: Sequelize): typeof UserAddress {
    UserAddress.init(
      {
        userId: { type: DataTypes.UUID, primaryKey: true },
        name: { type: DataTypes.STRING(100), allowNull: false },
        line1: { type: DataTypes.STRING(120), allowNull: false },
        line2: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
        city: { type: DataTypes.STRING(80), allowNull: false },
        region: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "" },
        postalCode: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "" },
        country: { type: DataTypes.CHAR(2), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "addresses", modelName: "UserAddress", underscored: true },
    );
    return UserAddress;
  }
}
