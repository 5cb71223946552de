import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** A message taken by the local SMTP catcher (development, demo and tests only). */
export class CaughtMail extends Model<InferAttributes<CaughtMail>, InferCreationAttributes<CaughtMail>> {
  declare id: CreationOptional<string>;
  declare labId: string | null;
  /** invitation, password-reset or review; null for messages caught before kinds were recorded. */
  declare kind: string | null;
  /** Who sent it (the inviter of an invitation). */
  declare senderId: string | null;
  declare fromAddress: string;
  declare toAddresses: string[];
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string | null;
  declare raw: string;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize): void {
    CaughtMail.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        labId: { type: DataTypes.UUID, allowNull: true },
        kind: { type: DataTypes.STRING(40), allowNull: true },
        senderId: { type: DataTypes.UUID, allowNull: true },
        fromAddress: { type: DataTypes.TEXT, allowNull: false },
        toAddresses: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
        subject: { type: DataTypes.TEXT, allowNull: false },
        textBody: { type: DataTypes.TEXT, allowNull: false },
        htmlBody: { type: DataTypes.TEXT, allowNull: true },
        raw: { type: DataTypes.TEXT, allowNull: false },
        receivedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'caught_mail', timestamps: false },
    );
  }
}
