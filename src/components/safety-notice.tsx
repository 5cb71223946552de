/** The hazards Halflight reminds people of where the work involves them (docs/product.md, section 4). */
export type Hazard = 'light' | 'toxic-quencher' | 'flammable-solvent' | 'pressurised-gas';

const cautions: Record<Hazard, string> = {
  light:
    'Intense visible and UV lamps, LEDs and lasers harm eyes and skin: wear eye protection rated for the wavelength and shield the beam path.',
  'toxic-quencher':
    'Many quenchers are toxic or corrosive (amines, some bipyridinium salts are highly toxic): handle stocks in a fume hood with gloves and read the safety data sheet first.',
  'flammable-solvent':
    'Acetonitrile, THF, alcohols and other common solvents are flammable and harmful: keep them away from ignition sources and work in a ventilated place.',
  'pressurised-gas':
    'Degassing uses pressurised argon or nitrogen: secure cylinders, use a regulator and a bubbler or vent, and never close off a line under pressure.',
};

/**
 * A short list of the usual cautions. It is a reminder, not a safety approval: the safety data
 * sheets and the institution's rules decide.
 */
export function SafetyNotice({ hazards, extra = [] }: { hazards: readonly Hazard[]; extra?: readonly string[] }) {
  if (hazards.length === 0 && extra.length === 0) return null;
  return (
    <aside aria-label="Safety" className="rounded-card border border-glow-300 bg-glow-50 p-4 text-body text-ink-800">
      <h2 className="mb-2 text-body font-black tracking-wide text-glow-700">Before you start</h2>
      <ul className="list-disc space-y-1 pl-5">
        {hazards.map((hazard) => (
          <li key={hazard}>{cautions[hazard]}</li>
        ))}
        {extra.map((note) => (
          <li key={note}>{note}</li>
        ))}
      </ul>
      <p className="mt-2 text-caption text-ink-600">
        Halflight gives no safety approval. Follow the safety data sheets and your institution&apos;s safety rules.
      </p>
    </aside>
  );
}
