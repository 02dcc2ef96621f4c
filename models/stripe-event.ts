import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';

/** Each Stripe event id is processed once: inserting its id is the claim. */
export class StripeEvent extends Model<InferAttributes<StripeEvent>, InferCreationAttributes<StripeEvent>> {
  declare id: string;
  declare type: string;
  declare receivedAt: CreationOptional<Date>;
}

export function initStripeEvent(sequelize: Sequelize) {
  return StripeEvent.init(
    {
      id: { type: DataTypes.STRING(120), primaryKey: true },
      type: { type: DataTypes.STRING(80), allowNull: false },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, modelName: 'StripeEvent', tableName: 'stripe_events', underscored: true, timestamps: false },
  );
}
