import { Op } from 'sequelize';
import { Study, StudyFit } from '../../models';

export interface KqCandidate {
  studyId: string;
  title: string;
  status: string;
  kq: number;
  solvent: string | null;
  updatedAt: string;
}

const statusRank: Record<string, number> = { approved: 0, submitted: 1, draft: 2, returned: 3 };

/**
 * The lab's current studies of this emitter against this quencher that have a kq: those in the
 * reaction's solvent first (kq depends on the solvent), then approved before unapproved, then
 * the most recently updated.
 */
export async function kqCandidates(
  labId: string,
  emitterId: string,
  quencherId: string,
  solvent: string,
): Promise<KqCandidate[]> {
  const studies = await Study.findAll({
    where: { labId, emitterId, quencherId, isCurrent: true, kq: { [Op.ne]: null } },
    order: [['updatedAt', 'DESC']],
    limit: 50,
  });
  return studies
    .map((study) => ({
      studyId: study.id,
      title: study.title,
      status: study.status,
      kq: study.kq!,
      solvent: study.solventId ?? study.customSolventName,
      updatedAt: study.updatedAt.toISOString(),
    }))
    .sort(
      (a, b) =>
        Number(b.solvent === solvent) - Number(a.solvent === solvent) ||
        (statusRank[a.status] ?? 9) - (statusRank[b.status] ?? 9),
    );
}

/** Standard error of kq from the study's newest fit, when it has one. */
export async function kqStandardError(studyId: string): Promise<number | null> {
  const study = await Study.findByPk(studyId, { attributes: ['latestFitId'] });
  if (!study?.latestFitId) return null;
  const fit = await StudyFit.findByPk(study.latestFitId, { attributes: ['result'] });
  return fit?.result.parameters.kq?.standardError ?? null;
}
