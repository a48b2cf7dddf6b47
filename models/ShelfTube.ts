import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import type { Maker } from "./Maker";

export type AttributionBasis = "source-code-confirmed" | "construction-matched" | "unconfirmed";

/**
 * One tube a dealer is holding: its label, codes and construction. Tubes
 * confirmed by a source code become reference examples for their maker.
 */
export class ShelfTube extends Model<InferAttributes<ShelfTube>, InferCreationAttributes<ShelfTube>> {
  declare id: CreationOptional<string>;
  declare ownerId: string;
  declare designation: string;
  declare labelBrand: CreationOptional<string>;
  declare sourceCode: CreationOptional<string | null>;
  declare dateCode: CreationOptional<string | null>;
  declare features: Record<string, unknown>;
  declare basis: CreationOptional<AttributionBasis>;
  declare makerId: CreationOptional<number | null>;
  declare notes: CreationOptional<string>;
  declare clientKey: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare maker?: Maker | null;

  static initModel(sequelize: Sequelize): typeof ShelfTube {
    ShelfTube.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        ownerId: { type: DataTypes.UUID, allowNull: false },
        designation: { type: DataTypes.STRING(32), allowNull: false },
        labelBrand: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
        sourceCode: { type: DataTypes.STRING(16), allowNull: true },
        dateCode: { type: DataTypes.STRING(16), allowNull: true },
        features: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        basis: { type: DataTypes.STRING(32), allowNull: false, defaultValue: "unconfirmed" },
        makerId: { type: DataTypes.INTEGER, allowNull: true },
        notes: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: "" },
        clientKey: { type: DataTypes.STRING(64), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "shelf_tubes", modelName: "ShelfTube" },
    );
    return ShelfTube;
  }
}
