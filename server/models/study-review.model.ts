import { DataTypes } from 'sequelize';
import type { ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import { CreatedRecord, createdRecordColumns } from './record';
import type { Study } from './study.model';
import type { User } from './user.model';

export type ReviewAction = 'submit' | 'approve' | 'return' | 'comment';

/** One step of a study's review thread: a submission, a decision or a comment. */
export class StudyReview extends CreatedRecord<StudyReview> {
  declare studyId: ForeignKey<Study['id']>;
  declare authorId: ForeignKey<User['id']> | null;
  declare action: ReviewAction;
  declare comment: string;
  declare author?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    StudyReview.init(
      {
        ...createdRecordColumns(),
        action: { type: DataTypes.ENUM('submit', 'approve', 'return', 'comment'), allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      },
      { sequelize, tableName: 'study_reviews', updatedAt: false },
    );
  }
}
