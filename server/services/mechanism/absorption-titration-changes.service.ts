import { ENGINE_VERSION } from '@shared/engine';
import type {
  AbsorptionReanalysis,
  AbsorptionSettings,
  AbsorptionTitrationReanalysed,
} from '@shared/schemas/absorption-titrations';
import type { SpectraDiscarded } from '@shared/schemas/spectrum-matrices';
import type { SignedInActor } from '../../domain/actor';
import type { LabContext } from '../../domain/lab-context';
import { AppError } from '../../lib/app-error';
import { AbsorptionTitration, type MechanismFile } from '../../models';
import { recordLabAudit } from '../audit.service';
import { loadStudyToChange } from '../studies/study-access';
import { reanalysedColumns } from '../studies/files/attached-files';
import type { UploadServices } from '../studies/study-upload.service';
import { chosenAssociation, readOrRefuse, settingsOf, toAnswer, withFiles } from './absorption-titrations.service';
import { verdictChange } from './mechanism-evidence.service';
import { releaseMechanismFiles } from './release-mechanism-files';

const notFound = () =>
  new AppError('absorption_titration_not_found', 'No such absorption titration in this study.', 404);

async function findTitration(lab: LabContext, studyId: string, titrationId: string) {
  const row = await AbsorptionTitration.findOne({
    where: { id: titrationId, labId: lab.id, studyId },
    include: withFiles,
  });
  if (!row) throw notFound();
  return row;
}

/** What the audit log keeps of one analysis: the settings, the flags and the K_a the verdict reads. */
function auditedAnalysis(settings: AbsorptionSettings, analysis: AbsorptionTitration['analysis']) {
  const kA = chosenAssociation(analysis, settings.associationFit)?.fit.kA ?? null;
  return { settings, flags: analysis.flags.map((flag) => flag.code), kA };
}

/**
 * Analyses a kept titration again from its kept files with new settings (band width, path length,
 * [E]0, whether the quencher's own absorbance is taken out, which K_a the verdict uses): the
 * owner, while the study may change. Nothing changes unless the files read and the analysis runs
 * (422 naming the problem). The verdict before and after goes into the audit entry with the old
 * and new settings, flags and K_a, and comes back beside the titration.
 */
export async function reanalyseAbsorptionTitration(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  titrationId: string,
  input: AbsorptionReanalysis,
  actor: SignedInActor,
): Promise<AbsorptionTitrationReanalysed> {
  const study = await loadStudyToChange(lab, studyId, actor.userId);
  const row = await findTitration(lab, studyId, titrationId);
  if (input.subtractQuencher && !row.quencherFile)
    throw new AppError(
      'no_quencher_file',
      "This titration was kept without the quencher's own file, so there is nothing to take out. Keep the titration again with the quencher's file, or analyse it without.",
      422,
      [{ path: 'body.subtractQuencher', message: 'the titration has no quencher file' }],
    );
  const options = {
    bandWidth: input.bandWidth,
    pathLength: input.pathLength,
    ...(input.emitterConcentration !== null ? { emitterConcentration: input.emitterConcentration } : {}),
  };
  const received = async (file: MechanismFile) => ({
    originalname: file.fileName,
    mimetype: file.mediaType,
    buffer: await services.files.read({ ...file.get({ plain: true }), kind: 'mechanism-file' }),
  });
  const outcome = await readOrRefuse(
    services,
    {
      file: await received(row.file!),
      quencher: input.subtractQuencher ? await received(row.quencherFile!) : null,
      options,
    },
    'Nothing was changed.',
  );
  const settings: AbsorptionSettings = {
    ...options,
    subtractQuencher: input.subtractQuencher,
    associationFit: input.associationFit,
  };
  const verdict = await verdictChange(lab, studyId, {
    absorptionTitration: { id: row.id, change: { analysis: outcome.analysis, settings } },
  });
  await services.sequelize.transaction(async (transaction) => {
    await loadStudyToChange(lab, studyId, actor.userId, transaction);
    const locked = await AbsorptionTitration.findOne({
      where: { id: titrationId, labId: lab.id, studyId },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!locked) throw notFound();
    const before = auditedAnalysis(settingsOf(locked), locked.analysis);
    await locked.update(
      { bandWidth: settings.bandWidth, options: settings, ...reanalysedColumns(outcome) },
      { transaction },
    );
    await recordLabAudit({ lab, actor, transaction }, 'absorption_titration_reanalysed', ['study', studyId], {
      absorptionTitrationId: row.id,
      before,
      after: auditedAnalysis(settings, outcome.analysis),
      verdict: { before: verdict.before, after: verdict.after },
      engineVersion: ENGINE_VERSION,
    });
  });
  return { titration: await toAnswer(await findTitration(lab, studyId, titrationId), study), verdict };
}

/**
 * Removes a kept titration and its files (the owner, while the study may change); a file another
 * revision of the study still names stays. The audit entry keeps the files' names and SHA-256 and
 * the verdict before and after. Bytes in object storage are removed after the commit.
 */
export async function discardAbsorptionTitration(
  services: UploadServices,
  lab: LabContext,
  studyId: string,
  titrationId: string,
  actor: SignedInActor,
): Promise<SpectraDiscarded> {
  await loadStudyToChange(lab, studyId, actor.userId);
  await findTitration(lab, studyId, titrationId);
  const verdict = await verdictChange(lab, studyId, { absorptionTitration: { id: titrationId, change: null } });
  const locations = await services.sequelize.transaction(async (transaction) => {
    await loadStudyToChange(lab, studyId, actor.userId, transaction);
    const row = await AbsorptionTitration.findOne({
      where: { id: titrationId, labId: lab.id, studyId },
      include: withFiles.slice(0, 2),
      transaction,
    });
    if (!row) throw notFound();
    const files = [row.file!, ...(row.quencherFile ? [row.quencherFile] : [])];
    await row.destroy({ transaction });
    const released = await releaseMechanismFiles(lab.id, files, transaction);
    await recordLabAudit({ lab, actor, transaction }, 'absorption_titration_discarded', ['study', studyId], {
      absorptionTitrationId: row.id,
      files: files.map((file) => ({ id: file.id, fileName: file.fileName, sha256: file.sha256 })),
      filesRemoved: released.removed,
      ...auditedAnalysis(settingsOf(row), row.analysis),
      verdict: { before: verdict.before, after: verdict.after },
    });
    return released.locations;
  });
  for (const location of locations) await services.files.discard(location);
  return { verdict };
}
