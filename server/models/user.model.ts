import { DataTypes } from 'sequelize';
import type { CreationOptional, Sequelize } from 'sequelize';
import { TimestampedRecord, recordColumns } from './record';

export class User extends TimestampedRecord<User> {
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  declare lastSignInAt: CreationOptional<Date | null>;
  /** Base32 TOTP secret; set only while two-step sign-in is on. */
  declare totpSecret: CreationOptional<string | null>;
  declare totpEnabledAt: CreationOptional<Date | null>;
  /** The RFC 6238 time step of the last accepted code, so a code never works twice. */
  declare totpLastStep: CreationOptional<number | null>;

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        ...recordColumns(),
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        lastSignInAt: { type: DataTypes.DATE, allowNull: true },
        totpSecret: { type: DataTypes.STRING(64), allowNull: true },
        totpEnabledAt: { type: DataTypes.DATE, allowNull: true },
        totpLastStep: { type: DataTypes.BIGINT, allowNull: true },
      },
      { sequelize, tableName: 'users' },
    );
  }
}
