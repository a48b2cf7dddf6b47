import {
  DataTypes,
  Model,
  Op,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
  type Transaction,
} from "sequelize";
import type { ReferenceType } from "../lib/valves/reference-row";

/** The editable part of a reference row (everything but its names and source). */
export type ValveTypeData = Omit<ReferenceType, "designation" | "aliases" | "source">;

/** Reference data for one type, as the house keeps it (loaded from published figures, corrected with history). */
export class ValveType extends Model<InferAttributes<ValveType>, InferCreationAttributes<ValveType>> {
  declare designation: string;
  declare aliases: string[];
  declare data: ValveTypeData;
  declare source: string;
  declare revision: CreationOptional<number>;
  declare updatedBy: CreationOptional<string | null>;
  /** Set when the house retires the type: kept with its history, no longer on file. */
  declare retiredAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** The row as the pure code's ReferenceType. */
  toReference(): ReferenceType {
    return {
      ...this.data,
      designation: this.designation,
      aliases: this.aliases,
      source: this.source as ReferenceType["source"],
    };
  }

  /** Find by designation or alias (already normalised), retired rows included. */
  static findByName(name: string, transaction?: Transaction): Promise<ValveType | null> {
    return ValveType.findOne({
      where: { [Op.or]: [{ designation: name }, { aliases: { [Op.contains]: [name] } }] },
      transaction,
    });
  }

  /** The rows on file (not retired), in designation order. */
  static onFile(): Promise<ValveType[]> {
    return ValveType.findAll({ where: { retiredAt: null }, order: [["designation", "ASC"]] });
  }

  /** The revision counter every change to valve_types bumps (a statement trigger). */
  static async tableRevision(): Promise<string> {
    const [rows] = await ValveType.sequelize!.query(`SELECT revision FROM reference_revision WHERE id = 1`);
    return String((rows as { revision: string | number }[])[0]?.revision ?? "0");
  }

  static initModel(sequelize: Sequelize): typeof ValveType {
    ValveType.init(
      {
        designation: { type: DataTypes.STRING(32), primaryKey: true },
        aliases: { type: DataTypes.ARRAY(DataTypes.STRING(32)), allowNull: false, defaultValue: [] },
        data: { type: DataTypes.JSONB, allowNull: false },
        source: { type: DataTypes.STRING(40), allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        updatedBy: { type: DataTypes.UUID, allowNull: true },
        retiredAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "valve_types", modelName: "ValveType" },
    );
    return ValveType;
  }
}

/** One recorded change to a reference row: who, when, why, before and after. */
export class ValveTypeRevision extends Model<
  InferAttributes<ValveTypeRevision>,
  InferCreationAttributes<ValveTypeRevision>
> {
  declare id: CreationOptional<number>;
  declare designation: string;
  declare revision: number;
  declare changedBy: string | null;
  declare reason: string;
  declare before: unknown;
  declare after: unknown;
  declare createdAt: CreationOptional<Date>;
  declare changer?: { displayName: string } | null;

  static initModel(sequelize: Sequelize): typeof ValveTypeRevision {
    ValveTypeRevision.init(
      {
        id: {
          type: DataTypes.BIGINT,
          autoIncrement: true,
          primaryKey: true,
          get() {
            return Number(this.getDataValue("id"));
          },
        },
        designation: { type: DataTypes.STRING(32), allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        changedBy: { type: DataTypes.UUID, allowNull: true },
        reason: { type: DataTypes.STRING(500), allowNull: false },
        before: { type: DataTypes.JSONB, allowNull: false },
        after: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "valve_type_revisions", modelName: "ValveTypeRevision", updatedAt: false },
    );
    return ValveTypeRevision;
  }
}
