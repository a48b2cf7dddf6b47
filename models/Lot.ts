import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import type { LotEvent } from "./LotEvent";
import type { LotItem } from "./LotItem";
import type { LotPhoto } from "./LotPhoto";

/** Our own names for a lot's way through intake. */
export const LOT_STATES = ["draft", "in-review", "needs-changes", "approved", "declined"] as const;
export type LotState = (typeof LOT_STATES)[number];

export const TESTER_KINDS = ["untested", "mutual-conductance", "emission", "curve-tracer", "other"] as const;
export type TesterKind = (typeof TESTER_KINDS)[number];

/** A consigned box of valves with its evidence, on its way to sale. */
export class Lot extends Model<InferAttributes<Lot>, InferCreationAttributes<Lot>> {
  declare id: CreationOptional<string>;
  declare consignorId: string;
  declare title: string;
  declare provenance: CreationOptional<string>;
  declare shippingOrigin: CreationOptional<string>;
  declare testerKind: CreationOptional<TesterKind>;
  declare testerNotes: CreationOptional<string>;
  declare state: CreationOptional<LotState>;
  declare estimateLowCents: CreationOptional<number | null>;
  declare estimateHighCents: CreationOptional<number | null>;
  declare reserveCents: CreationOptional<number | null>;
  declare reserveAgreedAt: CreationOptional<Date | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare approvedAt: CreationOptional<Date | null>;
  declare approvedBy: CreationOptional<string | null>;
  declare extraReview: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare items?: NonAttribute<LotItem[]>;
  declare photos?: NonAttribute<LotPhoto[]>;
  declare events?: NonAttribute<LotEvent[]>;
  declare consignor?: NonAttribute<{ id: string; displayName: string }>;

  /** The consignor may edit only while the lot is theirs to change. */
  get editableByConsignor(): NonAttribute<boolean> {
    return this.state === "draft" || this.state === "needs-changes";
  }

  static initModel(sequelize: Sequelize): typeof Lot {
    Lot.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        consignorId: { type: DataTypes.UUID, allowNull: false },
        title: { type: DataTypes.STRING(140), allowNull: false },
        provenance: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        shippingOrigin: { type: DataTypes.STRING(140), allowNull: false, defaultValue: "" },
        testerKind: { type: DataTypes.STRING(32), allowNull: false, defaultValue: "untested" },
        testerNotes: { type: DataTypes.STRING(500), allowNull: false, defaultValue: "" },
        state: { type: DataTypes.STRING(24), allowNull: false, defaultValue: "draft" },
        estimateLowCents: { type: DataTypes.INTEGER, allowNull: true },
        estimateHighCents: { type: DataTypes.INTEGER, allowNull: true },
        reserveCents: { type: DataTypes.INTEGER, allowNull: true },
        reserveAgreedAt: { type: DataTypes.DATE, allowNull: true },
        submittedAt: { type: DataTypes.DATE, allowNull: true },
        approvedAt: { type: DataTypes.DATE, allowNull: true },
        approvedBy: { type: DataTypes.UUID, allowNull: true },
        extraReview: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "lots", modelName: "Lot" },
    );
    return Lot;
  }
}
