import type { DrivingForceResult, MissingInput, Pathway } from '@shared/schemas/driving-force';
import { ErrorNotice } from '@/components/error-notice';
import { NotesList } from '@/components/notes-list';
import { Panel } from '@/components/panel';
import { Signal } from '@/components/signal';
import { TextLink } from '@/components/text-link';
import { useDrivingForce } from '../api/get-driving-force';
import { formatElectronvolts, formatKilojoules, formatVolts, solventName } from './library-format';
import { paths } from '@/lib/paths';

export interface DrivingForcePanelProps {
  labId: string;
  emitterId: string;
  quencherId: string;
  /** Solvent id of the study (engine table), for the Coulomb term; null for a solvent outside the table */
  solvent: string | null;
  /** The mechanism the user expects, or null */
  pinned: Pathway | null;
  /** Called with the pathway to pin, or null to unpin; omit to hide the pin buttons (read-only). */
  onPin?: (pathway: Pathway | null) => void;
}

const pathwayWords: Record<Pathway, { title: string; says: string }> = {
  oxidative: { title: 'Oxidative quenching', says: 'the excited emitter gives an electron to the quencher' },
  reductive: { title: 'Reductive quenching', says: 'the quencher gives an electron to the excited emitter' },
};

/**
 * The electron-transfer driving force of an emitter–quencher pair (Rehm–Weller estimate, as
 * computed by the server with the engine), both pathways, the favourable one marked, the
 * Coulomb term apart, energy transfer, and each missing number with a link to add it.
 */
export function DrivingForcePanel({ labId, emitterId, quencherId, solvent, pinned, onPin }: DrivingForcePanelProps) {
  const force = useDrivingForce(
    labId,
    { emitterId, quencherId, solvent: solvent ?? '', pinned: pinned ?? undefined },
    solvent !== null,
  );
  return (
    <Panel
      title="Electron-transfer driving force"
      aside={force.isFetching ? <Signal tone="waiting">Computing</Signal> : undefined}
    >
      {solvent === null && (
        <p className="text-body text-ink-700">
          The driving force is read in a solvent of the table (its permittivity sets the Coulomb term); this
          study&apos;s solvent is not in it.
        </p>
      )}
      {force.isError && <ErrorNotice error={force.error} what="the driving force" />}
      {force.data && <DrivingForceBody labId={labId} result={force.data} onPin={onPin} />}
    </Panel>
  );
}

function DrivingForceBody({
  labId,
  result,
  onPin,
}: {
  labId: string;
  result: DrivingForceResult;
  onPin?: DrivingForcePanelProps['onPin'];
}) {
  const blocked = (pathway: Pathway) => result.missing.filter((item) => item.neededFor.includes(pathway));
  return (
    <div className="space-y-4">
      <p className="text-body text-ink-700">
        {result.emitter.name} with {result.quencher.name} in {solventName(result.solvent)}; potentials against{' '}
        {result.reference}. ΔG<sub>ET</sub> = e[E(D+/D) − E(A/A−)] − E00, with the Coulomb term w shown apart.
      </p>
      <div className="grid gap-3 md:grid-cols-2">
        {(['oxidative', 'reductive'] as const).map((pathway) => (
          <PathwayCard
            key={pathway}
            pathway={pathway}
            result={result}
            missing={blocked(pathway)}
            labId={labId}
            onPin={onPin}
          />
        ))}
      </div>
      <EnergyTransfer result={result} labId={labId} />
      <NotesList items={result.warnings} label="Conversion warnings" />
    </div>
  );
}

interface CardProps {
  pathway: Pathway;
  result: DrivingForceResult;
  missing: MissingInput[];
  labId: string;
  onPin?: DrivingForcePanelProps['onPin'];
}

function PathwayCard({ pathway, result, missing, labId, onPin }: CardProps) {
  const value = result[pathway];
  const highlighted = result.highlighted === pathway;
  const isPinned = result.pinned === pathway;
  return (
    <section
      aria-label={pathwayWords[pathway].title}
      className={`rounded-md border p-3 ${highlighted ? 'border-glow-400 bg-glow-50' : 'border-paper-300 bg-white'}`}
    >
      <header className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="text-body font-bold text-ink-900">{pathwayWords[pathway].title}</h3>
        <span className="flex gap-1.5">
          {result.favoured === pathway && <Signal tone="good">More favourable</Signal>}
          {isPinned && <Signal tone="waiting">Pinned as expected</Signal>}
        </span>
      </header>
      <p className="text-caption text-ink-500">{pathwayWords[pathway].says}</p>
      {value ? (
        <dl className="mt-2 grid grid-cols-2 gap-x-3 gap-y-1 text-body">
          <dt className="text-ink-600">
            ΔG<sub>ET</sub>
          </dt>
          <dd className="font-bold text-ink-950">
            {formatElectronvolts(value.electronvolts)}{' '}
            <span className="font-normal text-ink-600">({formatKilojoules(value.kilojoulesPerMole)})</span>
          </dd>
          <dt className="text-ink-600">Coulomb term w</dt>
          <dd>
            {formatElectronvolts(value.workTerm)}{' '}
            <span className="text-caption text-ink-500">(with w: {formatElectronvolts(value.withWorkTerm)})</span>
          </dd>
          <dt className="text-ink-600">from</dt>
          <dd className="text-caption text-ink-700">
            E(D+/D) {formatVolts(value.donorOxidation)}, E(A/A−) {formatVolts(value.acceptorReduction)}, E00{' '}
            {formatElectronvolts(value.e00, false)}
          </dd>
        </dl>
      ) : (
        <MissingList labId={labId} missing={missing} />
      )}
      {onPin && value && (
        <button
          type="button"
          className="mt-2 text-caption font-bold text-ink-800 underline decoration-glow-400 underline-offset-4"
          onClick={() => onPin(isPinned ? null : pathway)}
        >
          {isPinned ? 'Unpin this mechanism' : 'Pin as the expected mechanism'}
        </button>
      )}
    </section>
  );
}

function MissingList({ labId, missing }: { labId: string; missing: MissingInput[] }) {
  return (
    <ul className="mt-2 space-y-1 text-body text-brick-700">
      {missing.map((item) => (
        <li key={`${item.compoundId}-${item.quantity}`}>
          Missing: {item.message}.{' '}
          <TextLink
            to={paths.compound(
              labId,
              item.compoundId,
              `add-${item.quantity === 'tripletEnergy' ? 'compound' : item.quantity === 'e00' ? 'e00' : 'potential'}`,
            )}
          >
            Add it
          </TextLink>
        </li>
      ))}
    </ul>
  );
}

function EnergyTransfer({ result, labId }: { result: DrivingForceResult; labId: string }) {
  const missing = result.missing.filter((item) => item.quantity === 'tripletEnergy');
  return (
    <section aria-label="Energy transfer" className="rounded-md border border-paper-300 bg-white p-3">
      <h3 className="text-body font-bold text-ink-900">Triplet energy transfer</h3>
      {result.energyTransfer ? (
        <p className="text-body text-ink-800">
          {result.energyTransfer.possible ? 'Possible: ' : 'Uphill: '}
          the quencher&apos;s triplet lies{' '}
          {formatElectronvolts(Math.abs(result.energyTransfer.energyDifference), false)}{' '}
          {result.energyTransfer.possible ? 'below' : 'above'} the emitter&apos;s (
          {formatKilojoules(result.energyTransfer.kilojoulesPerMole)}).
        </p>
      ) : (
        <MissingList labId={labId} missing={missing} />
      )}
    </section>
  );
}
