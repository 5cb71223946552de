import type { DecayOutcome } from '@shared/schemas/decays';
import { formatEstimate, formatNumber } from '@shared/format';
import { fromSi, toNanoseconds } from '@shared/units/units';

// Each value to the decimal of its standard error, as printed in a paper (5.996 ± 0.005, not 5.996 ± 4.8 × 10⁻³).
const estimate = ({ value, standardError }: { value: number; standardError: number }, scale: (x: number) => number) =>
  formatEstimate(scale(value), scale(standardError));
const ns = (lifetime: { value: number; standardError: number }) => estimate(lifetime, toNanoseconds);
const plain = (x: number) => x;

/** The fitted parameters of one decay with their standard errors, and its flags. */
export function DecayParameters({ outcome }: { outcome: DecayOutcome }) {
  const { fit } = outcome;
  if (!fit) return <p className="text-body text-brick-700">{outcome.problem ?? 'Not fitted yet.'}</p>;
  const rows: Array<[string, string]> = [
    ...fit.components.flatMap((component, i): Array<[string, string]> => [
      [`τ${i + 1} (ns)`, ns(component.lifetime)],
      [`α${i + 1} (share of amplitude)`, estimate(component.fractionalAmplitude, plain)],
      [`f${i + 1} (share of photons)`, formatNumber(component.fractionalIntensity, 3)],
    ]),
    ...(fit.components.length > 1
      ? ([
          ['⟨τ⟩ amplitude-weighted (ns)', ns(fit.amplitudeWeightedLifetime)],
          ['⟨τ⟩ intensity-weighted (ns)', ns(fit.intensityWeightedLifetime)],
        ] as Array<[string, string]>)
      : []),
    ['Background (counts/channel)', estimate(fit.background, plain)],
    ...(fit.shift
      ? ([['Response shift (ps)', estimate(fit.shift, (seconds) => fromSi(seconds, 'ps'))]] as Array<[string, string]>)
      : []),
    ['Reduced χ² (Pearson)', formatNumber(fit.reducedChiSquared, 3)],
    ['Channels fitted', `${fit.startChannel}–${fit.endChannel}`],
    ['Peak counts', formatNumber(fit.peakCounts, 5)],
  ];
  return (
    <div className="space-y-2">
      <table aria-label={`Parameters of ${outcome.label}`} className="w-full text-body">
        <tbody>
          {rows.map(([name, value]) => (
            <tr key={name} className="border-b border-paper-200">
              <th scope="row" className="py-1 pr-3 text-left font-normal text-ink-700">
                {name}
              </th>
              <td className="whitespace-nowrap py-1 font-bold tabular-nums">{value}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-caption text-ink-500">
        {fit.method === 'reconvolution' ? 'Reconvolution with the measured response' : 'Tail fit'},{' '}
        {fit.estimator === 'poisson' ? 'Poisson maximum likelihood' : 'least squares weighted by 1/max(counts, 1)'}.
        {outcome.lifetime?.basis === 'amplitude-weighted-mean' &&
          ' The Stern–Volmer plot takes the amplitude-weighted mean lifetime.'}
      </p>
      {fit.flags.map((flag) => (
        <div key={flag.code} role="note" className="rounded-md border border-glow-300 bg-glow-50 px-3 py-2 text-body">
          <p className="font-bold">{flag.title}</p>
          <p>{flag.explanation}</p>
          {flag.whatToDo && (
            <p>
              <strong>What to do:</strong> {flag.whatToDo}
            </p>
          )}
          {flag.detail && <p className="text-caption">{flag.detail}</p>}
        </div>
      ))}
    </div>
  );
}
