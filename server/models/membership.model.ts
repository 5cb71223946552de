import { DataTypes } from 'sequelize';
import type { ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { Role } from '@shared/schemas/roles';
import { roles } from '@shared/schemas/roles';
import type { Lab } from './lab.model';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

export class Membership extends LabRecord<Membership> {
  declare userId: ForeignKey<User['id']>;
  declare role: Role;
  declare lab?: NonAttribute<Lab>;
  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize): void {
    Membership.init(
      {
        ...recordColumns(),
        role: { type: DataTypes.ENUM(...roles), allowNull: false },
      },
      { sequelize, tableName: 'memberships' },
    );
  }
}
