import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import { serialId, voidColumns, timestamps } from './columns';
import type { Lot } from './lot';
import type { ContainerType } from './container-type';

/** A weighed bucket or tank of a lot. Corrected by voiding, never deleted. */
export class LotContainer extends Model<InferAttributes<LotContainer>, InferCreationAttributes<LotContainer>> {
  declare id: CreationOptional<number>;
  declare lotId: number;
  declare containerTypeId: CreationOptional<number | null>;
  declare label: CreationOptional<string>;
  declare grossGrams: number;
  declare tareGrams: number;
  declare recordedBy: number | null;
  declare voidedAt: CreationOptional<Date | null>;
  declare voidedBy: CreationOptional<number | null>;
  declare voidReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare lot?: NonAttribute<Lot>;
  declare containerType?: NonAttribute<ContainerType | null>;
}

export function initLotContainer(sequelize: Sequelize) {
  return LotContainer.init(
    {
      ...serialId(),
      lotId: { type: DataTypes.INTEGER, allowNull: false },
      containerTypeId: { type: DataTypes.INTEGER, allowNull: true },
      label: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
      grossGrams: { type: DataTypes.INTEGER, allowNull: false },
      tareGrams: { type: DataTypes.INTEGER, allowNull: false },
      recordedBy: { type: DataTypes.INTEGER, allowNull: true },
      ...voidColumns(),
      ...timestamps(),
    },
    { sequelize, modelName: 'LotContainer', tableName: 'lot_containers', underscored: true },
  );
}
