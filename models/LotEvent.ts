import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";

export type LotEventKind =
  "created" | "submitted" | "changes-requested" | "approved" | "declined" | "amended" | "imported";

/** The dated trail of a lot: submissions, review decisions with comments, amendments after approval. */
export class LotEvent extends Model<InferAttributes<LotEvent>, InferCreationAttributes<LotEvent>> {
  declare id: CreationOptional<number>;
  declare lotId: string;
  declare actorId: string | null;
  declare kind: LotEventKind;
  declare comment: CreationOptional<string>;
  declare details: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<{ displayName: string } | null>;

  static initModel(sequelize: Sequelize): typeof LotEvent {
    LotEvent.init(
      {
        id: {
          type: DataTypes.BIGINT,
          autoIncrement: true,
          primaryKey: true,
          get() {
            return Number(this.getDataValue("id"));
          },
        },
        lotId: { type: DataTypes.UUID, allowNull: false },
        actorId: { type: DataTypes.UUID, allowNull: true },
        kind: { type: DataTypes.STRING(24), allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "lot_events", modelName: "LotEvent", updatedAt: false },
    );
    return LotEvent;
  }
}

/** A CSV file applied to a lot; the same file (by fingerprint) adds nothing a second time. */
export class LotImport extends Model<InferAttributes<LotImport>, InferCreationAttributes<LotImport>> {
  declare id: CreationOptional<number>;
  declare lotId: string;
  declare fingerprint: string;
  declare fileName: CreationOptional<string>;
  declare rowsAdded: number;
  declare rowsSkipped: number;
  declare createdBy: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof LotImport {
    LotImport.init(
      {
        id: {
          type: DataTypes.BIGINT,
          autoIncrement: true,
          primaryKey: true,
          get() {
            return Number(this.getDataValue("id"));
          },
        },
        lotId: { type: DataTypes.UUID, allowNull: false },
        fingerprint: { type: DataTypes.STRING(64), allowNull: false },
        fileName: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        rowsAdded: { type: DataTypes.INTEGER, allowNull: false },
        rowsSkipped: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "lot_imports", modelName: "LotImport", updatedAt: false },
    );
    return LotImport;
  }
}
