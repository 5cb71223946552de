import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type { FitModel, FitWeighting, StudyStatus } from '@shared/schemas/studies';
import type { Compound } from './compound.model';
import type { StudyUpload } from './study-upload.model';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

/** One emitter against one quencher in one solvent at one temperature (units: s, L, mol/L, Pa s, K, nm). */
export class Study extends LabRecord<Study> {
  declare emitterId: ForeignKey<Compound['id']>;
  declare quencherId: ForeignKey<Compound['id']>;
  declare title: string;
  declare solventId: string | null;
  declare customSolventName: string | null;
  declare customViscosity: number | null;
  declare temperature: number;
  declare excitationWavelength: number | null;
  declare emissionWavelength: number | null;
  declare windowStart: number | null;
  declare windowEnd: number | null;
  declare atmosphere: string;
  declare degassingMethod: string;
  declare tau0: number | null;
  declare tau0Uncertainty: number | null;
  declare tau0LifetimeId: string | null;
  /** the decay set whose zero-concentration decays gave tau0 */
  declare tau0DecaySetId: CreationOptional<string | null>;
  declare i0: number | null;
  declare dataKind: 'intensity' | 'ratio';
  declare fitModel: FitModel;
  declare fitWeighting: CreationOptional<FitWeighting>;
  declare dilutionCorrection: boolean;
  declare initialVolume: number | null;
  declare stockConcentration: number | null;
  declare stockContainsEmitter: boolean;
  declare innerFilterCorrection: boolean;
  declare pinnedMechanism: 'oxidative' | 'reductive' | 'energy-transfer' | null;
  declare notes: string;
  declare ownerId: ForeignKey<User['id']> | null;
  declare status: CreationOptional<StudyStatus>;
  declare revision: CreationOptional<number>;
  declare previousRevisionId: string | null;
  declare isCurrent: CreationOptional<boolean>;
  declare kSv: CreationOptional<number | null>;
  declare kq: CreationOptional<number | null>;
  declare flagged: CreationOptional<boolean>;
  declare fitProblem: CreationOptional<string | null>;
  declare latestFitId: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  declare emitter?: NonAttribute<Compound>;
  declare quencher?: NonAttribute<Compound>;
  declare owner?: NonAttribute<User | null>;
  /** Only as an include asks for them (receiveUpload: an earlier upload of the same bytes). */
  declare uploads?: NonAttribute<StudyUpload[]>;

  static initModel(sequelize: Sequelize): void {
    const double = () => ({ type: DataTypes.DOUBLE, allowNull: true });
    Study.init(
      {
        ...recordColumns(),
        title: { type: DataTypes.STRING(200), allowNull: false },
        solventId: { type: DataTypes.STRING(40), allowNull: true },
        customSolventName: { type: DataTypes.STRING(80), allowNull: true },
        customViscosity: double(),
        temperature: { type: DataTypes.DOUBLE, allowNull: false },
        excitationWavelength: double(),
        emissionWavelength: double(),
        windowStart: double(),
        windowEnd: double(),
        atmosphere: { type: DataTypes.STRING(20), allowNull: false },
        degassingMethod: { type: DataTypes.STRING(40), allowNull: false },
        tau0: double(),
        tau0Uncertainty: double(),
        tau0LifetimeId: { type: DataTypes.UUID, allowNull: true },
        tau0DecaySetId: { type: DataTypes.UUID, allowNull: true },
        i0: double(),
        dataKind: { type: DataTypes.STRING(20), allowNull: false },
        fitModel: { type: DataTypes.STRING(20), allowNull: false },
        fitWeighting: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'unweighted' },
        dilutionCorrection: { type: DataTypes.BOOLEAN, allowNull: false },
        initialVolume: double(),
        stockConcentration: double(),
        stockContainsEmitter: { type: DataTypes.BOOLEAN, allowNull: false },
        innerFilterCorrection: { type: DataTypes.BOOLEAN, allowNull: false },
        pinnedMechanism: { type: DataTypes.STRING(20), allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        status: {
          type: DataTypes.ENUM('draft', 'submitted', 'approved', 'returned'),
          allowNull: false,
          defaultValue: 'draft',
        },
        revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        previousRevisionId: { type: DataTypes.UUID, allowNull: true },
        isCurrent: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        kSv: double(),
        kq: double(),
        flagged: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        fitProblem: { type: DataTypes.TEXT, allowNull: true },
        latestFitId: { type: DataTypes.UUID, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'studies' },
    );
  }
}
