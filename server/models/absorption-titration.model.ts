import { DataTypes } from 'sequelize';
import type { ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type {
  AbsorptionAnalysisAnswer,
  AbsorptionOptions,
  AbsorptionPlot,
  AbsorptionSettings,
} from '@shared/schemas/absorption-titrations';
import type { SpectrumMatrixReading } from '@shared/schemas/spectrum-matrices';
import type { MechanismFile } from './mechanism-file.model';
import type { Study } from './study.model';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

/** What the quencher's own file was read as (the reading of a titration row with a quencher file). */
export interface StoredQuencherReading {
  header: string;
  kind: 'absorptivity' | 'spectrum';
  concentration: number | null;
}

/**
 * UV-vis spectra of a study's emitter at several [Q]: a row of spectrum_matrices with kind
 * 'absorption' (migration 20261202-2000), read from one kept file (and the quencher's own
 * spectrum from a second) and analysed for a ground-state complex.
 */
export class AbsorptionTitration extends LabRecord<AbsorptionTitration> {
  declare studyId: ForeignKey<Study['id']>;
  declare fileId: ForeignKey<MechanismFile['id']>;
  declare quencherFileId: ForeignKey<MechanismFile['id']> | null;
  declare kind: 'absorption';
  declare title: string;
  declare bandWidth: number;
  /** as uploaded; a titration analysed again also stores whether the quencher was taken out and which K_a is used */
  declare options: AbsorptionOptions & Partial<Pick<AbsorptionSettings, 'subtractQuencher' | 'associationFit'>>;
  declare reading: SpectrumMatrixReading & { quencher: StoredQuencherReading | null };
  declare analysis: AbsorptionAnalysisAnswer;
  declare plot: AbsorptionPlot;
  declare engineVersion: string;
  declare createdById: ForeignKey<User['id']> | null;
  declare file?: NonAttribute<MechanismFile>;
  declare quencherFile?: NonAttribute<MechanismFile | null>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    AbsorptionTitration.init(
      {
        ...recordColumns(),
        kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'absorption' },
        title: { type: DataTypes.STRING(255), allowNull: false },
        bandWidth: { type: DataTypes.DOUBLE, allowNull: false },
        options: { type: DataTypes.JSONB, allowNull: false },
        reading: { type: DataTypes.JSONB, allowNull: false },
        analysis: { type: DataTypes.JSONB, allowNull: false },
        plot: { type: DataTypes.JSONB, allowNull: false },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false },
      },
      {
        sequelize,
        tableName: 'spectrum_matrices',
        // Emission matrices share the table; this model only ever sees its own kind.
        defaultScope: { where: { kind: 'absorption' } },
      },
    );
  }
}
