import { DataTypes } from 'sequelize';
import type { CreationOptional, ForeignKey, NonAttribute, Sequelize } from 'sequelize';
import type {
  SpectrumMatrixAnalysisAnswer,
  SpectrumMatrixReading,
  SpectrumPlot,
} from '@shared/schemas/spectrum-matrices';
import type { MechanismFile } from './mechanism-file.model';
import type { Study } from './study.model';
import type { User } from './user.model';
import { LabRecord, recordColumns } from './record';

/** Emission spectra of a study at several [Q], read from one kept file and analysed band by band. */
export class SpectrumMatrix extends LabRecord<SpectrumMatrix> {
  declare studyId: ForeignKey<Study['id']>;
  declare fileId: ForeignKey<MechanismFile['id']>;
  declare kind: CreationOptional<'emission'>;
  declare title: string;
  /** nm; 0 means one band per wavelength */
  declare bandWidth: number;
  declare reading: SpectrumMatrixReading;
  declare analysis: SpectrumMatrixAnalysisAnswer;
  declare plot: SpectrumPlot;
  declare engineVersion: string;
  declare createdById: ForeignKey<User['id']> | null;
  declare file?: NonAttribute<MechanismFile>;
  declare createdBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize): void {
    SpectrumMatrix.init(
      {
        ...recordColumns(),
        kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'emission' },
        title: { type: DataTypes.STRING(255), allowNull: false },
        bandWidth: { type: DataTypes.DOUBLE, allowNull: false },
        reading: { type: DataTypes.JSONB, allowNull: false },
        analysis: { type: DataTypes.JSONB, allowNull: false },
        plot: { type: DataTypes.JSONB, allowNull: false },
        engineVersion: { type: DataTypes.STRING(20), allowNull: false },
      },
      // Absorption titrations share the table (kind 'absorption', AbsorptionTitration); the column's default is 'emission'.
      { sequelize, tableName: 'spectrum_matrices', defaultScope: { where: { kind: 'emission' } } },
    );
  }
}
