import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { Role } from '@shared/schemas/roles';
import { roles } from '@shared/schemas/roles';
import type { Lab } from './lab.model';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

export class Invitation extends LabRecord<Invitation> {
  declare invitedById: ForeignKey<User['id']>;
  declare email: string;
  declare role: Role;
  /** SHA-256 of the token in the e-mailed link; the token itself is never stored. */
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare lab?: NonAttribute<Lab>;
  declare invitedBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    Invitation.init(
      {
        ...recordColumns(),
        email: { type: DataTypes.STRING(254), allowNull: false },
        role: { type: DataTypes.ENUM(...roles), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
      },
      { sequelize, tableName: 'invitations' },
    );
  }
}
