import type { TubeReading } from "../lib/lots/item";
import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export type ItemCondition = "new-in-box" | "new-old-stock" | "used";
export type MakerBasis = "source-code-confirmed" | "construction-matched" | "unconfirmed";

/** One tester run on one tube of an item (the domain's own shape). */
export type StoredReading = TubeReading;

/** A line of a lot: one type, label and maker, with its quantity, codes, condition and readings. */
export class LotItem extends Model<InferAttributes<LotItem>, InferCreationAttributes<LotItem>> {
  declare id: CreationOptional<string>;
  declare lotId: string;
  declare position: number;
  declare designationTyped: string;
  declare designation: string;
  declare designationKnown: boolean;
  declare quantity: number;
  declare labelBrand: CreationOptional<string>;
  declare makerName: CreationOptional<string | null>;
  declare makerBasis: CreationOptional<MakerBasis>;
  declare sourceCode: CreationOptional<string | null>;
  declare dateCode: CreationOptional<string | null>;
  declare features: CreationOptional<Record<string, string>>;
  declare condition: ItemCondition;
  declare vacuumLoss: CreationOptional<boolean>;
  declare soldAsSet: CreationOptional<boolean>;
  declare defects: CreationOptional<string[]>;
  declare hazards: CreationOptional<string[]>;
  declare readings: CreationOptional<StoredReading[]>;
  declare notes: CreationOptional<string>;
  declare importKey: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof LotItem {
    LotItem.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        lotId: { type: DataTypes.UUID, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        designationTyped: { type: DataTypes.STRING(64), allowNull: false },
        designation: { type: DataTypes.STRING(40), allowNull: false },
        designationKnown: { type: DataTypes.BOOLEAN, allowNull: false },
        quantity: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        labelBrand: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
        makerName: { type: DataTypes.STRING(120), allowNull: true },
        makerBasis: { type: DataTypes.STRING(32), allowNull: false, defaultValue: "unconfirmed" },
        sourceCode: { type: DataTypes.STRING(16), allowNull: true },
        dateCode: { type: DataTypes.STRING(16), allowNull: true },
        features: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        condition: { type: DataTypes.STRING(16), allowNull: false },
        vacuumLoss: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        soldAsSet: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        defects: { type: DataTypes.ARRAY(DataTypes.STRING(200)), allowNull: false, defaultValue: [] },
        hazards: { type: DataTypes.ARRAY(DataTypes.STRING(24)), allowNull: false, defaultValue: [] },
        readings: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: "" },
        importKey: { type: DataTypes.STRING(64), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "lot_items", modelName: "LotItem" },
    );
    return LotItem;
  }
}
