import type { Sequelize } from 'sequelize';
import { AuditEvent } from './audit-event.model';
import { CaughtMail } from './caught-mail.model';
import { Compound } from './compound.model';
import { Invitation } from './invitation.model';
import { Lab } from './lab.model';
import { Membership } from './membership.model';
import { PasswordReset } from './password-reset.model';
import { User } from './user.model';

/** Binds every model to one Sequelize instance and declares the associations; call once per instance. */
export function initModels(sequelize: Sequelize): void {
  for (const model of [Lab, User, Membership, Invitation, PasswordReset, CaughtMail, AuditEvent, Compound]) {
    model.initModel(sequelize);
  }
  Membership.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  Membership.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Lab.hasMany(Membership, { as: 'memberships', foreignKey: 'labId' });
  User.hasMany(Membership, { as: 'memberships', foreignKey: 'userId' });
  Invitation.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  Invitation.belongsTo(User, { as: 'invitedBy', foreignKey: 'invitedById' });
  PasswordReset.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  Compound.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  Compound.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Lab.hasMany(Compound, { as: 'compounds', foreignKey: 'labId' });
}

export { AuditEvent, CaughtMail, Compound, Invitation, Lab, Membership, PasswordReset, User };
