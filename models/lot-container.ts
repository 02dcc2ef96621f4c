import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { lotRecordColumns, type LotRecordFields } from './columns';
import type { ContainerType } from './container-type';

/** A weighed bucket or tank of a lot. Corrected by voiding, never deleted. */
export interface LotContainer extends LotRecordFields {}
export class LotContainer extends Model<InferAttributes<LotContainer>, InferCreationAttributes<LotContainer>> {
  declare containerTypeId: CreationOptional<number | null>;
  declare label: CreationOptional<string>;
  declare grossGrams: number;
  declare tareGrams: number;
  declare recordedBy: number | null;
  declare containerType?: NonAttribute<ContainerType | null>;
}

export function initLotContainer(sequelize: Sequelize) {
  return LotContainer.init(
    lotRecordColumns({
      containerTypeId: { type: DataTypes.INTEGER, allowNull: true },
      label: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
      grossGrams: { type: DataTypes.INTEGER, allowNull: false },
      tareGrams: { type: DataTypes.INTEGER, allowNull: false },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
    }),
    { sequelize, modelName: 'LotContainer', tableName: 'lot_containers', underscored: true },
  );
}
