import { formatEstimate, formatNumber, UNITS } from '@shared/format';
import { toKilojoulesPerMole } from '@shared/units/units';
import type { TemperatureSeriesAnalysis } from '@shared/schemas/temperature-series';
import { NotesList } from '@/components/notes-list';

const verdictWords: Record<TemperatureSeriesAnalysis['verdict'], { title: string; tone: string }> = {
  dynamic: { title: 'Dynamic: collisions during the excited state', tone: 'border-moss-500 bg-moss-100' },
  static: { title: 'Static: a complex formed before excitation', tone: 'border-brick-500 bg-brick-100' },
  'mixed-or-unclear': { title: 'Mixed or unclear', tone: 'border-glow-400 bg-glow-50' },
};

const kj = toKilojoulesPerMole;

/** The verdict in words with its reasons, and the activation parameters with their SEs. */
export function SeriesVerdict({ analysis }: { analysis: TemperatureSeriesAnalysis }) {
  const words = verdictWords[analysis.verdict];
  const meanT = analysis.points.reduce((sum, p) => sum + p.temperature, 0) / analysis.points.length;
  return (
    <div className="space-y-4">
      <div role="status" aria-label="Temperature verdict" className={`rounded-md border-l-4 p-4 ${words.tone}`}>
        <p className="text-lead font-bold text-ink-950">{words.title}</p>
        <NotesList items={analysis.reasons} size="body" className="mt-2" />
      </div>
      <dl className="grid gap-x-6 gap-y-2 text-body md:grid-cols-2">
        <div>
          <dt className="text-caption font-bold text-ink-600">Ea of kq (Arrhenius)</dt>
          <dd aria-label="Activation energy">
            {analysis.arrhenius
              ? formatEstimate(
                  kj(analysis.arrhenius.activationEnergy.value),
                  kj(analysis.arrhenius.activationEnergy.standardError),
                  UNITS.kilojoulePerMole,
                )
              : 'needs τ0 at every temperature'}
          </dd>
        </div>
        <div>
          <dt className="text-caption font-bold text-ink-600">Viscous flow of the solvent, E_η</dt>
          <dd>
            {formatNumber(kj(analysis.viscousFlowActivationEnergy))} {UNITS.kilojoulePerMole}; a diffusion-controlled kq
            shows about E_η + RT̄ = {formatNumber(kj(analysis.viscousFlowActivationEnergy + 8.314462618 * meanT))}{' '}
            {UNITS.kilojoulePerMole}
          </dd>
        </div>
        {analysis.eyring && (
          <>
            <div>
              <dt className="text-caption font-bold text-ink-600">ΔH‡ (Eyring)</dt>
              <dd>
                {formatEstimate(
                  kj(analysis.eyring.activationEnthalpy.value),
                  kj(analysis.eyring.activationEnthalpy.standardError),
                  UNITS.kilojoulePerMole,
                )}
              </dd>
            </div>
            <div>
              <dt className="text-caption font-bold text-ink-600">ΔS‡ (Eyring, 1 M standard state)</dt>
              <dd>
                {formatEstimate(
                  analysis.eyring.activationEntropy.value,
                  analysis.eyring.activationEntropy.standardError,
                  'J mol⁻¹ K⁻¹',
                )}
              </dd>
            </div>
          </>
        )}
      </dl>
      <NotesList items={analysis.notes} />
    </div>
  );
}
