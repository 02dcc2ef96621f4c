import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { serialId, timestamps, type Timestamps } from './columns';
import type { LabelLayout } from '@/lib/domain/label-layout';

/** A saved label sheet layout (named LabelLayoutRecord: LabelLayout is the domain type it stores). */
export interface LabelLayoutRecord extends Timestamps {}
export class LabelLayoutRecord extends Model<
  InferAttributes<LabelLayoutRecord>,
  InferCreationAttributes<LabelLayoutRecord>
> {
  declare id: CreationOptional<number>;
  declare name: string;
  /** In millimetres. */
  declare layout: LabelLayout;
}

export function initLabelLayoutRecord(sequelize: Sequelize) {
  return LabelLayoutRecord.init(
    {
      ...serialId(),
      name: { type: DataTypes.STRING(60), allowNull: false, unique: true },
      layout: { type: DataTypes.JSONB, allowNull: false },
      ...timestamps(),
    },
    { sequelize, modelName: 'LabelLayoutRecord', tableName: 'label_layouts', underscored: true },
  );
}
