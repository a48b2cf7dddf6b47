import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import type { ProxyState } from "../lib/auction/proxy";

/** A sale: approved lots offered together, closing one after another. */
export class Sale extends Model<InferAttributes<Sale>, InferCreationAttributes<Sale>> {
  declare id: CreationOptional<string>;
  declare title: string;
  declare startsAt: Date;
  declare softCloseSeconds: CreationOptional<number>;
  /** The house settings version in force when the sale was scheduled; all its money and timing read it. */
  declare settingsVersion: CreationOptional<number>;
  /** Most late-bid extensions per lot (from that version), or null for no cap. */
  declare maxExtensions: CreationOptional<number | null>;
  declare isDemo: CreationOptional<boolean>;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare saleLots?: NonAttribute<SaleLot[]>;

  static initModel(sequelize: Sequelize): typeof Sale {
    Sale.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        title: { type: DataTypes.STRING(140), allowNull: false },
        startsAt: { type: DataTypes.DATE, allowNull: false },
        softCloseSeconds: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 120 },
        settingsVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        maxExtensions: { type: DataTypes.INTEGER, allowNull: true },
        isDemo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdBy: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "sales", modelName: "Sale" },
    );
    return Sale;
  }
}

export type SalePhase = "open" | "sold" | "unsold" | "withdrawn";

/** One lot in a sale: its clock, its bidding state and, once closed, its outcome. */
export class SaleLot extends Model<InferAttributes<SaleLot>, InferCreationAttributes<SaleLot>> {
  declare id: CreationOptional<string>;
  declare saleId: string;
  declare lotId: string;
  declare position: number;
  declare consignorId: string;
  declare phase: CreationOptional<SalePhase>;
  declare openingCents: number;
  declare closesAt: Date;
  declare originalCloseAt: Date;
  declare extensionCount: CreationOptional<number>;
  declare seq: CreationOptional<number>;
  declare priceCents: CreationOptional<number>;
  declare bidCount: CreationOptional<number>;
  declare leaderId: CreationOptional<string | null>;
  declare reserveMet: CreationOptional<boolean>;
  declare state: ProxyState;
  declare closedAt: CreationOptional<Date | null>;
  declare buyerId: CreationOptional<string | null>;
  declare hammerCents: CreationOptional<number | null>;
  declare unsoldReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare sale?: NonAttribute<Sale>;
  declare lot?: NonAttribute<{ id: string; title: string; consignor?: { displayName: string } }>;

  static initModel(sequelize: Sequelize): typeof SaleLot {
    SaleLot.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        saleId: { type: DataTypes.UUID, allowNull: false },
        lotId: { type: DataTypes.UUID, allowNull: false }, // one open or sold sale lot per lot (partial unique index)
        position: { type: DataTypes.INTEGER, allowNull: false },
        consignorId: { type: DataTypes.UUID, allowNull: false },
        phase: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "open" },
        openingCents: { type: DataTypes.INTEGER, allowNull: false },
        closesAt: { type: DataTypes.DATE, allowNull: false },
        originalCloseAt: { type: DataTypes.DATE, allowNull: false },
        extensionCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        seq: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        priceCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        bidCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        leaderId: { type: DataTypes.UUID, allowNull: true },
        reserveMet: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        state: { type: DataTypes.JSONB, allowNull: false },
        closedAt: { type: DataTypes.DATE, allowNull: true },
        buyerId: { type: DataTypes.UUID, allowNull: true },
        hammerCents: { type: DataTypes.INTEGER, allowNull: true },
        unsoldReason: { type: DataTypes.STRING(24), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "sale_lots", modelName: "SaleLot" },
    );
    return SaleLot;
  }
}

/** An in-app notice for one person (outbid, won, lot closed). */
export class Notice extends Model<InferAttributes<Notice>, InferCreationAttributes<Notice>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare text: string;
  declare href: string | null;
  declare readAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Notice {
    Notice.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false },
        text: { type: DataTypes.STRING(500), allowNull: false },
        href: { type: DataTypes.STRING(200), allowNull: true },
        readAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "notices", modelName: "Notice", updatedAt: false },
    );
    return Notice;
  }
}
