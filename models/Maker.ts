import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A tube factory in the house's registry (the demo registry holds invented ones, marked demo). */
export class Maker extends Model<InferAttributes<Maker>, InferCreationAttributes<Maker>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare isDemo: boolean;
  declare notes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Maker {
    Maker.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
        isDemo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: "" },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "makers", modelName: "Maker" },
    );
    return Maker;
  }
}

/** A source code registered to a maker: evidence of the responsible source, not proof of the factory. */
export class MakerCode extends Model<InferAttributes<MakerCode>, InferCreationAttributes<MakerCode>> {
  declare code: string;
  declare makerId: number;
  declare isDemo: boolean;
  declare notes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare maker?: Maker;

  static initModel(sequelize: Sequelize): typeof MakerCode {
    MakerCode.init(
      {
        code: { type: DataTypes.STRING(8), primaryKey: true },
        makerId: { type: DataTypes.INTEGER, allowNull: false },
        isDemo: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: "" },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "maker_codes", modelName: "MakerCode" },
    );
    return MakerCode;
  }
}
