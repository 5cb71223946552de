import type { StudyDetail } from '@shared/schemas/study-detail';

// Solvents of the engine table that are flammable (common practice; see each safety data sheet).
const FLAMMABLE = new Set(['acetonitrile', 'methanol', 'ethanol', 'thf', 'acetone', 'toluene', 'benzene', 'ethyl-acetate', '1,4-dioxane', 'dmf', 'dmac']);
// Name fragments of quencher classes that are often toxic or corrosive (amines; bipyridinium salts such as viologens).
const TOXIC_HINT = /amine|aniline|pyridin|viologen|bipyridinium|paraquat|DABCO|Et3N|DIPEA|hydrazine/i;

/** The usual cautions for this study's conditions; Halflight approves nothing. */
export function SafetyNotes({ study }: { study: Pick<StudyDetail, 'solventId' | 'degassingMethod' | 'quencher' | 'excitationWavelength'> }) {
  const notes = [
    `Intense light source${study.excitationWavelength !== null && study.excitationWavelength < 400 ? ' in the UV' : ''}: wear eye protection rated for the wavelength and shield the beam.`,
  ];
  if (study.solventId && FLAMMABLE.has(study.solventId)) notes.push('Flammable solvent: keep ignition sources away and work in a fume hood.');
  if (TOXIC_HINT.test(study.quencher.name)) notes.push(`${study.quencher.name} may be toxic or corrosive (many amines are; some bipyridinium salts are highly toxic): gloves and fume hood.`);
  if (study.degassingMethod === 'sparging' || study.degassingMethod === 'freeze-pump-thaw') {
    notes.push(study.degassingMethod === 'sparging' ? 'Sparging uses pressurised gas: secure the cylinder and vent the cuvette.' : 'Freeze–pump–thaw: use liquid-nitrogen protection and check the glassware for stars before vacuum.');
  }
  return (
    <aside aria-label="Safety" className="rounded-card border border-glow-300 bg-glow-50 p-4 text-body text-ink-800">
      <p className="font-bold">Before you measure</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        {notes.map((note) => <li key={note}>{note}</li>)}
      </ul>
      <p className="mt-2 text-caption text-ink-500">Read the safety data sheets and follow your institution's rules; Halflight gives no safety approval.</p>
    </aside>
  );
}
