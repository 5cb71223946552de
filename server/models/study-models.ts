import type { Sequelize } from 'sequelize';
import { belongsToEach } from './associations';
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
  belongsToEach(Study, { lab: Lab, owner: User, emitter: Compound, quencher: Compound });
  belongsToEach(StudyUpload, { lab: Lab, uploadedBy: User, study: Study });
  belongsToEach(StudyFit, { createdBy: User, study: Study });
  belongsToEach(StudyReview, { author: User, study: Study });
  belongsToEach(StudyPoint, { study: Study });
  Study.hasMany(StudyPoint, { as: 'points', foreignKey: 'studyId' });
  Study.hasMany(StudyUpload, { as: 'uploads', foreignKey: 'studyId' });
}

export { Study, StudyFit, StudyPoint, StudyReview, StudyUpload };
