import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { User } from './user.model';
import { TimestampedRecord, recordColumns } from './record';

export class PasswordReset extends TimestampedRecord<PasswordReset> {
  declare userId: ForeignKey<User['id']>;
  /** SHA-256 of the token in the e-mailed link. */
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    PasswordReset.init(
      {
        ...recordColumns(),
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        usedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'password_resets' },
    );
  }
}
