import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, voidColumns, idempotencyKey, timestamps, type Timestamps, type VoidFields } from './columns';
import { SUPER_DEPTHS, type SuperDepth } from './super-tag';
import type { Colony } from './colony';
import type { Lot } from './lot';
import type { User } from './user';

/**
 * A super on a colony: put on, pulled (weighed full), later its empty weight and its lot. Its void fields are
 * set together when a pull recorded by mistake is voided (who, when, why); never edited or deleted.
 */
export interface SuperPull extends Timestamps, VoidFields<'voidedByUserId'> {}
export class SuperPull extends Model<InferAttributes<SuperPull>, InferCreationAttributes<SuperPull>> {
  declare id: CreationOptional<number>;
  declare colonyId: number;
  declare tagCode: CreationOptional<string | null>;
  declare depth: SuperDepth;
  declare frameCount: number;
  declare putOnOn: CreationOptional<string | null>;
  declare pulledOn: CreationOptional<string | null>;
  declare fullGrams: CreationOptional<number | null>;
  declare cappedFrames: CreationOptional<number | null>;
  declare emptyGrams: CreationOptional<number | null>;
  declare flagged: CreationOptional<boolean>;
  declare flagReasons: CreationOptional<string[]>;
  declare lotId: CreationOptional<number | null>;
  declare overrideReason: CreationOptional<string | null>;
  declare overrideBy: CreationOptional<number | null>;
  declare putOnBy: CreationOptional<number | null>;
  declare pulledBy: CreationOptional<number | null>;
  /** The key of the entry that created the row (a put-on, or a pull with no put-on). */
  declare idempotencyKey: CreationOptional<string | null>;
  /** The key of the pull entry that closed the row. */
  declare pullKey: CreationOptional<string | null>;
  declare note: CreationOptional<string>;
  declare colony?: NonAttribute<Colony>;
  declare lot?: NonAttribute<Lot | null>;
  declare voidedBy?: NonAttribute<User | null>;
}

export function initSuperPull(sequelize: Sequelize) {
  return SuperPull.init(
    {
      ...serialId(),
      colonyId: { type: DataTypes.INTEGER, allowNull: false },
      tagCode: { type: DataTypes.STRING(30), allowNull: true },
      depth: { type: DataTypes.STRING(10), allowNull: false, validate: { isIn: [SUPER_DEPTHS] } },
      frameCount: { type: DataTypes.INTEGER, allowNull: false },
      putOnOn: { type: DataTypes.DATEONLY, allowNull: true },
      pulledOn: { type: DataTypes.DATEONLY, allowNull: true },
      fullGrams: { type: DataTypes.INTEGER, allowNull: true },
      cappedFrames: { type: DataTypes.DECIMAL(4, 1), allowNull: true },
      emptyGrams: { type: DataTypes.INTEGER, allowNull: true },
      flagged: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      flagReasons: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      lotId: { type: DataTypes.INTEGER, allowNull: true },
      overrideReason: { type: DataTypes.TEXT, allowNull: true },
      overrideBy: { type: DataTypes.INTEGER, allowNull: true },
      putOnBy: { type: DataTypes.INTEGER, allowNull: true },
      pulledBy: { type: DataTypes.INTEGER, allowNull: true },
      ...idempotencyKey(),
      pullKey: { type: DataTypes.STRING(80), allowNull: true, unique: true },
      note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      ...voidColumns('voidedByUserId'),
      ...timestamps(),
    },
    { sequelize, modelName: 'SuperPull', tableName: 'super_pulls', underscored: true },
  );
}
