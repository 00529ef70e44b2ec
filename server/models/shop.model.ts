import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** A workshop or firm whose members work on sketches together (the demo has one fabrication shop). */
export class Shop extends Model<InferAttributes<Shop>, InferCreationAttributes<Shop>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare city: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Shop.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
        city: { type: DataTypes.STRING(120), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'shops' },
    );
  }
}
