import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import { bigSerialId, createdAtOnly } from './columns';

export type AccountRequestKind = 'reset' | 'sign-up';

/** A password-reset or sign-up request, worked through after it was answered (lib/data/auth/account-requests.ts). */
export class AccountRequest extends Model<InferAttributes<AccountRequest>, InferCreationAttributes<AccountRequest>> {
  declare id: CreationOptional<number>;
  declare kind: AccountRequestKind;
  declare email: string;
  declare name: string | null;
  declare ip: string;
  declare createdAt: CreationOptional<Date>;
  declare processedAt: CreationOptional<Date | null>;
}

export function initAccountRequest(sequelize: Sequelize) {
  return AccountRequest.init(
    {
      ...bigSerialId(),
      kind: { type: DataTypes.STRING(16), allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      name: { type: DataTypes.STRING(120), allowNull: true },
      ip: { type: DataTypes.STRING(64), allowNull: false },
      ...createdAtOnly(),
      processedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, modelName: 'AccountRequest', tableName: 'account_requests', underscored: true, updatedAt: false },
  );
}
