import type { Transaction } from 'sequelize';
import { DecaySet } from '../../models';

/**
 * Copies a study's decay sets to its new revision: the same kept files (rows shared, bytes not
 * copied), model and fits, each as a set of the new study, so the revision's lifetimes and tau0
 * keep their source and can be fitted again without touching the approved revision. Answers old
 * set id -> new set id, to point the copied links at the copies.
 */
export async function copyDecaySets(
  fromStudyId: string,
  toStudyId: string,
  transaction: Transaction,
): Promise<Map<string, string>> {
  const copies = new Map<string, string>();
  const sets = await DecaySet.findAll({ where: { studyId: fromStudyId }, order: [['createdAt', 'ASC']], transaction });
  for (const set of sets) {
    const { id, version: _version, createdAt: _created, updatedAt: _updated, ...values } = set.get({ plain: true });
    const copy = await DecaySet.create({ ...values, studyId: toStudyId }, { transaction });
    copies.set(id, copy.id);
  }
  return copies;
}
