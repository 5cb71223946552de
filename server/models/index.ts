import type { Sequelize } from 'sequelize';
import { belongsToEach } from './associations';
import { AbsorptionTitration } from './absorption-titration.model';
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
  belongsToEach(Membership, { lab: Lab, user: User });
  belongsToEach(Invitation, { lab: Lab, invitedBy: User });
  belongsToEach(PasswordReset, { user: User });
  belongsToEach(Compound, { lab: Lab, createdBy: User });
  for (const measurement of [RedoxPotential, ExcitedStateLifetime, ExcitedStateEnergy]) {
    belongsToEach(measurement, { lab: Lab, createdBy: User, compound: Compound });
  }
  Lab.hasMany(Membership, { as: 'memberships', foreignKey: 'labId' });
  User.hasMany(Membership, { as: 'memberships', foreignKey: 'userId' });
  Lab.hasMany(Compound, { as: 'compounds', foreignKey: 'labId' });
  Compound.hasMany(RedoxPotential, { as: 'potentials', foreignKey: 'compoundId' });
  Compound.hasMany(ExcitedStateLifetime, { as: 'lifetimes', foreignKey: 'compoundId' });
  Compound.hasMany(ExcitedStateEnergy, { as: 'energies', foreignKey: 'compoundId' });
  initStudyModels(sequelize);
  initScenarioModels(sequelize);
  for (const model of [DecayFile, DecaySet, MechanismFile, SpectrumMatrix, AbsorptionTitration])
    model.initModel(sequelize);
  belongsToEach(DecayFile, { lab: Lab, uploadedBy: User });
  belongsToEach(MechanismFile, { lab: Lab, uploadedBy: User });
  belongsToEach(DecaySet, {
    lab: Lab,
    createdBy: User,
    study: Study,
    file: DecayFile,
    responseFile: DecayFile,
    compound: Compound,
    lifetime: ExcitedStateLifetime,
  });
  belongsToEach(SpectrumMatrix, { lab: Lab, createdBy: User, study: Study, file: MechanismFile });
  belongsToEach(AbsorptionTitration, {
    lab: Lab,
    createdBy: User,
    study: Study,
    file: MechanismFile,
    quencherFile: MechanismFile,
  });
}

export {
  AbsorptionTitration,
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
