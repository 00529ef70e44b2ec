import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './user.model';

import { shareModes, type ShareMode } from '../../shared/schema/sketchRequests';

export { shareModes, type ShareMode };

/** One suspension sketch; `document` holds the sketch file (JSON text), `version` counts saves. */
export class Sketch extends Model<InferAttributes<Sketch>, InferCreationAttributes<Sketch>> {
  declare id: CreationOptional<number>;
  declare ownerId: number;
  declare name: string;
  declare layout: string;
  declare document: string;
  declare version: CreationOptional<number>;
  declare share: CreationOptional<ShareMode>;
  declare shareToken: CreationOptional<string | null>;
  declare shareClassId: CreationOptional<number | null>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare owner?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    Sketch.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(200), allowNull: false },
        layout: { type: DataTypes.STRING(40), allowNull: false },
        document: { type: DataTypes.TEXT, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        share: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'private' },
        shareToken: { type: DataTypes.STRING(64), allowNull: true },
        shareClassId: { type: DataTypes.INTEGER, allowNull: true },
        // Soft delete by hand (not paranoid mode): deleted sketches are listed and restored explicitly.
        deletedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sketches' },
    );
  }
}
