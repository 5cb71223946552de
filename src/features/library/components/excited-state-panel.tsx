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

/** E*(PC+/PC*) = E(PC+/PC) − E00 and E*(PC* / PC−) = E(PC/PC−) + E00, each beside the numbers it comes from. */
export function ExcitedStatePanel({ state }: { state: ExcitedState }) {
  const row = 'grid gap-x-4 sm:grid-cols-[minmax(10rem,auto)_1fr] border-t border-paper-200 py-2';
  return (
    <Panel title="Excited-state potentials">
      <div className="text-body">
        <div className={row}>
          <span className="font-bold text-ink-900">E*(PC+/PC*)</span>
          <span>
            {state.excitedOxidation === null ? (
              '—'
            ) : (
              <strong>
                {formatVolts(state.excitedOxidation)} vs {state.reference}
              </strong>
            )}
            {state.oxidation && state.e00 && (
              <span className="block text-caption text-ink-600">
                = E(PC+/PC) {formatVolts(state.oxidation.value)} − E00 {formatElectronvolts(state.e00.value, false)}
              </span>
            )}
          </span>
        </div>
        <div className={row}>
          <span className="font-bold text-ink-900">E*(PC*/PC−)</span>
          <span>
            {state.excitedReduction === null ? (
              '—'
            ) : (
              <strong>
                {formatVolts(state.excitedReduction)} vs {state.reference}
              </strong>
            )}
            {state.reduction && state.e00 && (
              <span className="block text-caption text-ink-600">
                = E(PC/PC−) {formatVolts(state.reduction.value)} + E00 {formatElectronvolts(state.e00.value, false)}
              </span>
            )}
          </span>
        </div>
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
                E00 {formatElectronvolts(state.e00.value, false)}
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
