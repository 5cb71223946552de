import type { StudyDetail } from '@shared/schemas/study-detail';
import { SafetyNotice } from '@/components/safety-notice';
import type { Hazard } from '@/components/safety-notice';

// Solvents of the engine table that are flammable (common practice; see each safety data sheet).
const FLAMMABLE = new Set([
  'acetonitrile',
  'methanol',
  'ethanol',
  'thf',
  'acetone',
  'toluene',
  'benzene',
  'ethyl-acetate',
  '1,4-dioxane',
  'dmf',
  'dmac',
]);
// Name fragments of quencher classes that are often toxic or corrosive (amines; bipyridinium salts such as viologens).
const TOXIC_HINT = /amine|aniline|pyridin|viologen|bipyridinium|paraquat|DABCO|Et3N|DIPEA|hydrazine/i;

type SafetyFacts = Pick<StudyDetail, 'solventId' | 'degassingMethod' | 'quencher' | 'excitationWavelength'>;

/** Which of the usual cautions apply to this study's conditions; Halflight approves nothing. */
export function SafetyNotes({ study }: { study: SafetyFacts }) {
  const hazards: Hazard[] = ['light'];
  const extra: string[] = [];
  if (study.excitationWavelength !== null && study.excitationWavelength < 400)
    extra.push('The excitation is in the UV: use UV-rated eye protection.');
  if (study.solventId && FLAMMABLE.has(study.solventId)) hazards.push('flammable-solvent');
  if (TOXIC_HINT.test(study.quencher.name)) hazards.push('toxic-quencher');
  if (study.degassingMethod === 'sparging') hazards.push('pressurised-gas');
  if (study.degassingMethod === 'freeze-pump-thaw') {
    extra.push(
      'Freeze–pump–thaw: protect against liquid nitrogen and check the glassware for cracks before applying vacuum.',
    );
  }
  return <SafetyNotice hazards={hazards} extra={extra} />;
}
