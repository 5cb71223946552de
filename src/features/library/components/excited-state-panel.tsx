import type { ExcitedState, UsedPotential } from '@shared/schemas/library-views';
import { Panel } from '@/components/panel';
import { formatElectronvolts, formatVolts, kindLabels } from './library-format';

function Source({ used }: { used: UsedPotential }) {
  return (
    <span className="block text-caption text-ink-500">
      entered {formatVolts(used.original.value)} vs {used.original.reference},{' '}
      {kindLabels[used.original.kind as keyof typeof kindLabels] ?? used.original.kind}
      {used.original.source ? `, ${used.original.source}` : ''}
    </span>
  );
}

const row = 'grid gap-x-4 sm:grid-cols-[minmax(10rem,auto)_1fr] border-t border-paper-200 py-2';

/** One excited-state potential (a dash when it cannot be worked out) and the sum it comes from. */
function ExcitedPotential({
  label,
  value,
  reference,
  from,
}: {
  label: string;
  value: number | null;
  reference: string;
  from: string | false | null;
}) {
  return (
    <div className={row}>
      <span className="font-bold text-ink-900">{label}</span>
      <span>
        {value === null ? (
          '—'
        ) : (
          <strong>
            {formatVolts(value)} vs {reference}
          </strong>
        )}
        {from && <span className="block text-caption text-ink-600">= {from}</span>}
      </span>
    </div>
  );
}

/** E*(PC+/PC*) = E(PC+/PC) − E00 and E*(PC* / PC−) = E(PC/PC−) + E00, each beside the numbers it comes from. */
export function ExcitedStatePanel({ state }: { state: ExcitedState }) {
  const e00 = state.e00 && formatElectronvolts(state.e00.value, false);
  return (
    <Panel title="Excited-state potentials">
      <div className="text-body">
        <ExcitedPotential
          label="E*(PC+/PC*)"
          value={state.excitedOxidation}
          reference={state.reference}
          from={state.oxidation && e00 && `E(PC+/PC) ${formatVolts(state.oxidation.value)} − E00 ${e00}`}
        />
        <ExcitedPotential
          label="E*(PC*/PC−)"
          value={state.excitedReduction}
          reference={state.reference}
          from={state.reduction && e00 && `E(PC/PC−) ${formatVolts(state.reduction.value)} + E00 ${e00}`}
        />
        <div className={row}>
          <span className="text-ink-700">From</span>
          <span className="space-y-1">
            {state.oxidation && (
              <span className="block">
                E(PC+/PC) {formatVolts(state.oxidation.value)}
                <Source used={state.oxidation} />
              </span>
            )}
            {state.reduction && (
              <span className="block">
                E(PC/PC−) {formatVolts(state.reduction.value)}
                <Source used={state.reduction} />
              </span>
            )}
            {state.e00 && (
              <span className="block">
                E00 {e00}
                <span className="block text-caption text-ink-500">
                  {state.e00.wavelength ? `from ${state.e00.wavelength} nm, ` : ''}
                  {state.e00.method}
                </span>
              </span>
            )}
          </span>
        </div>
      </div>
      {state.missing.length > 0 && (
        <ul className="mt-2 list-disc pl-5 text-body text-brick-700">
          {state.missing.map((item) => (
            <li key={item}>Missing: {item}.</li>
          ))}
        </ul>
      )}
      <p className="mt-2 text-caption text-ink-500">
        Computed with the reversible E1/2 where there is one, else Ep/2 or Ep, and the most recent E00.
      </p>
    </Panel>
  );
}
