import type { Sequelize } from 'sequelize';
import { AuditEvent } from './audit-event.model';
import { CaughtMail } from './caught-mail.model';
import { Invitation } from './invitation.model';
import { Lab } from './lab.model';
import { Membership } from './membership.model';
import { PasswordReset } from './password-reset.model';
import { User } from './user.model';

/** Binds every model to one Sequelize instance and declares the associations; call once per instance. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [Lab, User, Membership, Invitation, PasswordReset, CaughtMail, AuditEvent]) {
    model.initModel(sequelize);
  }
  Membership.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  Membership.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Lab.hasMany(Membership, { as: 'memberships', foreignKey: 'labId' });
  User.hasMany(Membership, { as: 'memberships', foreignKey: 'userId' });
  Invitation.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  Invitation.belongsTo(User, { as: 'invitedBy', foreignKey: 'invitedById' });
  PasswordReset.belongsTo(User, { as: 'user', foreignKey: 'userId' });
}

export { AuditEvent, CaughtMail, Invitation, Lab, Membership, PasswordReset, User };
