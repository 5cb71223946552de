import type { Sequelize } from 'sequelize';
import { AuditEvent } from './audit-event.model';
import { CaughtMail } from './caught-mail.model';
import { Compound } from './compound.model';
import { DecayFile } from './decay-file.model';
import { DecaySet } from './decay-set.model';
import { ExcitedStateEnergy } from './excited-state-energy.model';
import { ExcitedStateLifetime } from './excited-state-lifetime.model';
import { Invitation } from './invitation.model';
import { Lab } from './lab.model';
import { MechanismFile } from './mechanism-file.model';
import { Membership } from './membership.model';
import { PasswordReset } from './password-reset.model';
import { RecoveryCode } from './recovery-code.model';
import { RedoxPotential } from './redox-potential.model';
import { initScenarioModels } from './scenario-models';
import { SpectrumMatrix } from './spectrum-matrix.model';
import { initStudyModels, Study } from './study-models';
import { User } from './user.model';

/** Binds every model to one Sequelize instance and declares the associations; call once per instance. */
export function initModels(sequelize: Sequelize): void {
  const models = [Lab, User, Membership, Invitation, PasswordReset, RecoveryCode, CaughtMail, AuditEvent, Compound];
  for (const model of [...models, RedoxPotential, ExcitedStateLifetime, ExcitedStateEnergy]) {
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
  RedoxPotential.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  ExcitedStateLifetime.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  ExcitedStateEnergy.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  RedoxPotential.belongsTo(Compound, { as: 'compound', foreignKey: 'compoundId' });
  ExcitedStateLifetime.belongsTo(Compound, { as: 'compound', foreignKey: 'compoundId' });
  ExcitedStateEnergy.belongsTo(Compound, { as: 'compound', foreignKey: 'compoundId' });
  RedoxPotential.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  ExcitedStateLifetime.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  ExcitedStateEnergy.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  Compound.hasMany(RedoxPotential, { as: 'potentials', foreignKey: 'compoundId' });
  Compound.hasMany(ExcitedStateLifetime, { as: 'lifetimes', foreignKey: 'compoundId' });
  Compound.hasMany(ExcitedStateEnergy, { as: 'energies', foreignKey: 'compoundId' });
  initStudyModels(sequelize);
  initScenarioModels(sequelize);
  DecayFile.initModel(sequelize);
  DecaySet.initModel(sequelize);
  DecaySet.belongsTo(DecayFile, { as: 'file', foreignKey: 'fileId' });
  DecaySet.belongsTo(DecayFile, { as: 'responseFile', foreignKey: 'responseFileId' });
  DecaySet.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  DecaySet.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  DecaySet.belongsTo(Study, { as: 'study', foreignKey: 'studyId' });
  DecaySet.belongsTo(Compound, { as: 'compound', foreignKey: 'compoundId' });
  DecaySet.belongsTo(ExcitedStateLifetime, { as: 'lifetime', foreignKey: 'lifetimeId' });
  DecayFile.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  DecayFile.belongsTo(User, { as: 'uploadedBy', foreignKey: 'uploadedById' });
  MechanismFile.initModel(sequelize);
  SpectrumMatrix.initModel(sequelize);
  MechanismFile.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  MechanismFile.belongsTo(User, { as: 'uploadedBy', foreignKey: 'uploadedById' });
  SpectrumMatrix.belongsTo(MechanismFile, { as: 'file', foreignKey: 'fileId' });
  SpectrumMatrix.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  SpectrumMatrix.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  SpectrumMatrix.belongsTo(Study, { as: 'study', foreignKey: 'studyId' });
}

export {
  AuditEvent,
  CaughtMail,
  Compound,
  DecayFile,
  DecaySet,
  ExcitedStateEnergy,
  ExcitedStateLifetime,
  Invitation,
  Lab,
  MechanismFile,
  Membership,
  PasswordReset,
  RecoveryCode,
  RedoxPotential,
  SpectrumMatrix,
  User,
};
export { Study, StudyFit, StudyPoint, StudyReview, StudyUpload } from './study-models';
export { ReactionScenario, ScenarioComponent } from './scenario-models';
