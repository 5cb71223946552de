import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, ForeignKey, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { Study } from './study.model';

/** One reading of a series: [Q] mol/L, intensity (or I0/I), lifetime s, absorbances, volume added L. */
export class StudyPoint extends Model<InferAttributes<StudyPoint>, InferCreationAttributes<StudyPoint>> {
  declare id: CreationOptional<string>;
  declare studyId: ForeignKey<Study['id']>;
  declare position: number;
  declare concentration: number;
  declare intensity: number | null;
  declare lifetime: number | null;
  declare absorbanceExcitation: number | null;
  declare absorbanceEmission: number | null;
  declare volumeAdded: number | null;
  declare uncertainty: number | null;
  declare excluded: boolean;
  declare exclusionReason: string | null;
  declare uploadId: string | null;
  /** the titration run the reading belongs to (1, 2, …); each run has its own I0 */
  declare series: CreationOptional<number>;
  /** s, one standard error; set when the lifetime came from a fitted decay */
  declare lifetimeUncertainty: CreationOptional<number | null>;
  /** the decay set the lifetime was fitted from */
  declare lifetimeDecaySetId: CreationOptional<string | null>;

  static initModel(sequelize: Sequelize): void {
    const double = () => ({ type: DataTypes.DOUBLE, allowNull: true });
    StudyPoint.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        position: { type: DataTypes.INTEGER, allowNull: false },
        concentration: { type: DataTypes.DOUBLE, allowNull: false },
        intensity: double(),
        lifetime: double(),
        absorbanceExcitation: double(),
        absorbanceEmission: double(),
        volumeAdded: double(),
        uncertainty: double(),
        excluded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        exclusionReason: { type: DataTypes.TEXT, allowNull: true },
        uploadId: { type: DataTypes.UUID, allowNull: true },
        series: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        lifetimeUncertainty: double(),
        lifetimeDecaySetId: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: 'study_points', timestamps: false },
    );
  }
}
