import { DataTypes } from 'sequelize';
import type { CreationOptional, Sequelize } from 'sequelize';
import { CreatedRecord, createdRecordColumns } from './record';

/** One single-use recovery code for two-step sign-in; only its SHA-256 is kept. */
export class RecoveryCode extends CreatedRecord<RecoveryCode> {
  declare userId: string;
  declare codeHash: string;
  declare usedAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize): void {
    RecoveryCode.init(
      {
        ...createdRecordColumns(),
        userId: { type: DataTypes.UUID, allowNull: false },
        codeHash: { type: DataTypes.STRING(64), allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'recovery_codes', updatedAt: false },
    );
  }
}
