import type { Sequelize } from 'sequelize';
import { Compound } from './compound.model';
import { Lab } from './lab.model';
import { User } from './user.model';
import { StudyFit } from './study-fit.model';
import { StudyPoint } from './study-point.model';
import { StudyReview } from './study-review.model';
import { StudyUpload } from './study-upload.model';
import { Study } from './study.model';

/** Binds the study models and their associations (called from initModels after the library models). */
export function initStudyModels(sequelize: Sequelize): void {
  for (const model of [Study, StudyPoint, StudyUpload, StudyFit, StudyReview]) model.initModel(sequelize);
  Study.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  StudyUpload.belongsTo(Lab, { as: 'lab', foreignKey: 'labId' });
  Study.belongsTo(Compound, { as: 'emitter', foreignKey: 'emitterId' });
  Study.belongsTo(Compound, { as: 'quencher', foreignKey: 'quencherId' });
  Study.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  Study.hasMany(StudyPoint, { as: 'points', foreignKey: 'studyId' });
  StudyUpload.belongsTo(User, { as: 'uploadedBy', foreignKey: 'uploadedById' });
  StudyFit.belongsTo(User, { as: 'createdBy', foreignKey: 'createdById' });
  StudyReview.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  StudyPoint.belongsTo(Study, { as: 'study', foreignKey: 'studyId' });
  StudyUpload.belongsTo(Study, { as: 'study', foreignKey: 'studyId' });
  StudyFit.belongsTo(Study, { as: 'study', foreignKey: 'studyId' });
  StudyReview.belongsTo(Study, { as: 'study', foreignKey: 'studyId' });
}

export { Study, StudyFit, StudyPoint, StudyReview, StudyUpload };
