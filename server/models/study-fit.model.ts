import { DataTypes } from 'sequelize';
import type { ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { FitModel, FitWeighting } from '@shared/schemas/studies';
import type { FitResult, StudyFit as StudyFitRecord } from '@shared/schemas/study-fits';
import type { Study } from './study.model';
import type { User } from './user.model';
import { CreatedRecord, createdRecordColumns } from './record';

/** One fit as it was made; never updated (a refit is a new row). */
export class StudyFit extends CreatedRecord<StudyFit> {
  declare studyId: ForeignKey<Study['id']>;
  declare model: FitModel;
  /** the weighting chosen for this fit; null for fits made before the choice existed */
  declare weighting: FitWeighting | null;
  declare trigger: 'auto' | 'manual';
  declare kSv: number | null;
  declare kq: number | null;
  declare result: FitResult;
  declare pointsUsed: StudyFitRecord['pointsUsed'];
  declare engineVersion: string;
  declare createdById: ForeignKey<User['id']> | null;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    StudyFit.init(
      {
        ...createdRecordColumns(),
        model: { type: DataTypes.STRING(20), allowNull: false },
        weighting: { type: DataTypes.STRING(20), allowNull: true },
        trigger: { type: DataTypes.STRING(20), allowNull: false },
        kSv: { type: DataTypes.DOUBLE, allowNull: true },
        kq: { type: DataTypes.DOUBLE, allowNull: true },
        result: { type: DataTypes.JSONB, allowNull: false },
        pointsUsed: { type: DataTypes.JSONB, allowNull: false },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false },
      },
      { sequelize, tableName: 'study_fits', updatedAt: false },
    );
  }
}
