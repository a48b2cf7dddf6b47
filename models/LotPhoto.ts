import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A photo of a lot or one of its items; the image lives in object storage, re-encoded without metadata. */
export class LotPhoto extends Model<InferAttributes<LotPhoto>, InferCreationAttributes<LotPhoto>> {
  declare id: CreationOptional<string>;
  declare lotId: string;
  declare itemId: CreationOptional<string | null>;
  declare fullKey: string;
  declare thumbKey: string;
  declare width: number;
  declare height: number;
  declare bytes: number;
  declare sha256: string;
  declare caption: CreationOptional<string>;
  declare uploadedBy: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof LotPhoto {
    LotPhoto.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        lotId: { type: DataTypes.UUID, allowNull: false },
        itemId: { type: DataTypes.UUID, allowNull: true },
        fullKey: { type: DataTypes.STRING(200), allowNull: false },
        thumbKey: { type: DataTypes.STRING(200), allowNull: false },
        width: { type: DataTypes.INTEGER, allowNull: false },
        height: { type: DataTypes.INTEGER, allowNull: false },
        bytes: { type: DataTypes.INTEGER, allowNull: false },
        sha256: { type: DataTypes.STRING(64), allowNull: false },
        caption: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        uploadedBy: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "lot_photos", modelName: "LotPhoto", updatedAt: false },
    );
    return LotPhoto;
  }
}
