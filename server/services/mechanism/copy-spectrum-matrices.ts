import type { Transaction } from 'sequelize';
import { AbsorptionTitration, SpectrumMatrix } from '../../models';

/**
 * Copies a study's spectrum matrices and absorption titrations to its new revision, as decay sets
 * are copied (copyDecaySets): the same kept files (rows shared, bytes not copied), options and
 * analyses, each as a record of the new study, so the revision's mechanism evidence keeps its
 * source and can be analysed again without touching the approved revision. Each copy keeps when
 * and by whom the original was kept, so "the newest matrix" the verdict reads is the same one.
 * Answers how many of each were copied.
 */
export async function copySpectrumMatrices(
  fromStudyId: string,
  toStudyId: string,
  transaction: Transaction,
): Promise<{ emission: number; absorption: number }> {
  const order: [string, string][] = [['createdAt', 'ASC']];
  const matrices = await SpectrumMatrix.findAll({ where: { studyId: fromStudyId }, order, transaction });
  for (const matrix of matrices) {
    const { id: _id, updatedAt: _updated, ...values } = matrix.get({ plain: true });
    await SpectrumMatrix.create({ ...values, studyId: toStudyId }, { transaction });
  }
  const titrations = await AbsorptionTitration.findAll({ where: { studyId: fromStudyId }, order, transaction });
  for (const titration of titrations) {
    const { id: _id, updatedAt: _updated, ...values } = titration.get({ plain: true });
    await AbsorptionTitration.create({ ...values, studyId: toStudyId }, { transaction });
  }
  return { emission: matrices.length, absorption: titrations.length };
}
