import { DataTypes, Model } from 'sequelize';
import type {
  CreationOptional,
  ForeignKey,
  InferAttributes,
  InferCreationAttributes,
  NonAttribute,
  Sequelize,
} from 'sequelize';
import type { Study } from './study.model';
import type { User } from './user.model';

export type ReviewAction = 'submit' | 'approve' | 'return' | 'comment';

/** One step of a study's review thread: a submission, a decision or a comment. */
export class StudyReview extends Model<InferAttributes<StudyReview>, InferCreationAttributes<StudyReview>> {
  declare id: CreationOptional<string>;
  declare studyId: ForeignKey<Study['id']>;
  declare authorId: ForeignKey<User['id']> | null;
  declare action: ReviewAction;
  declare comment: string;
  declare createdAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    StudyReview.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        action: { type: DataTypes.ENUM('submit', 'approve', 'return', 'comment'), allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'study_reviews', updatedAt: false },
    );
  }
}
