import { decayCurves, EngineError, fitDecay, type DecayFit, type DecayInput } from '@shared/engine';
import type {
  DecayCurves,
  DecayLifetime,
  DecayModel,
  DecayOutcome,
  DecayReadingSummary,
  DecayReadOptions,
  DecayTimeUnit,
} from '@shared/schemas/decays';
import { TIME_UNITS } from '@shared/units/units';
import { ParseProblem } from '../studies/parse/parse-problem';
import type { DecayTable, DecayTableColumn } from './read-decay-table';

export interface DecaySetReading {
  summary: DecayReadingSummary;
  model: DecayModel;
  outcomes: DecayOutcome[];
  shown: DecayCurves | null;
  questions: string[];
}

/**
 * The lifetime a Stern–Volmer plot takes from a decay: tau of a single exponential, else the
 * amplitude-weighted mean sum(a tau)/sum(a) (shared/engine/README.md section 11; Lakowicz, 3rd ed., 2006, ch. 4).
 */
export function lifetimeOf(fit: DecayFit): DecayLifetime {
  return fit.components.length === 1
    ? { ...fit.components[0]!.lifetime, basis: 'single-exponential' }
    : { ...fit.amplitudeWeightedLifetime, basis: 'amplitude-weighted-mean' };
}

/** Roles and concentrations as chosen in the preview, over those proposed from the headers. */
function chosenColumns(table: DecayTable, options: DecayReadOptions): DecayTableColumn[] {
  if (!options.columns) return table.columns;
  const chosen = new Map(options.columns.map((column) => [column.column, column]));
  for (const column of chosen.keys())
    if (!table.columns.some((own) => own.column === column))
      throw new ParseProblem(`Column ${column} was chosen, but the file has columns 1 to ${table.columns.length}.`);
  return table.columns.map((column) => {
    const choice = chosen.get(column.column);
    return choice ? { ...column, role: choice.role, concentration: choice.concentration } : column;
  });
}

/** The response on the decay's channels: the one column so named, or the response file's first counts column. */
function responseOf(columns: DecayTableColumn[], responseTable: DecayTable | null, table: DecayTable) {
  const inColumns = columns.filter((column) => column.role === 'response');
  if (inColumns.length > 1)
    throw new ParseProblem(
      `Columns ${inColumns.map((column) => `"${column.header}"`).join(' and ')} are all marked as the response; keep one.`,
    );
  if (responseTable) {
    if (inColumns.length > 0)
      throw new ParseProblem(
        `The set has a response file and a response column ("${inColumns[0]!.header}"); mark the column "ignore" or leave the file out.`,
      );
    if (responseTable.time.length !== table.time.length)
      throw new ParseProblem(
        `The response file has ${responseTable.time.length} channels and the decay file ${table.time.length}; both must be recorded on the same channels.`,
      );
    return { counts: responseTable.columns[0]!.counts, source: 'file' as const };
  }
  return inColumns[0] ? { counts: inColumns[0].counts, source: 'column' as const } : null;
}

/**
 * Reads the decays of one file as chosen (time unit, column roles, concentrations, model) and
 * fits each with the engine: every decay gets its fit, or the reason it has none. Runs in the
 * upload-reading threads, so the fits never hold the event loop.
 */
export function fitDecaySet(
  table: DecayTable,
  responseTable: DecayTable | null,
  options: DecayReadOptions,
  stored: DecayOutcome[] | null = null,
): DecaySetReading {
  const columns = chosenColumns(table, options);
  const timeUnit: DecayTimeUnit | null = table.timeUnit ?? options.timeUnit;
  const questions: string[] = [];
  const warnings: string[] = [];
  if (!timeUnit)
    questions.push(
      `The time column "${table.timeHeader}" names no unit: choose ps, ns, µs, ms or s (Halflight does not guess one).`,
    );
  const response = responseOf(columns, responseTable, table);
  const decays = columns.filter((column) => column.role === 'decay');
  if (decays.length === 0) questions.push('No column is marked as a decay: mark at least one.');
  const channelWidth = timeUnit
    ? ((table.time.at(-1)! - table.time[0]!) / (table.time.length - 1)) * TIME_UNITS[timeUnit]
    : null;
  if (responseTable?.timeUnit && channelWidth !== null) {
    const own =
      ((responseTable.time.at(-1)! - responseTable.time[0]!) / (responseTable.time.length - 1)) *
      TIME_UNITS[responseTable.timeUnit];
    if (Math.abs(own - channelWidth) > 0.01 * channelWidth)
      throw new ParseProblem(
        `The response file's channels are ${own.toPrecision(4)} s wide and the decays' ${channelWidth.toPrecision(4)} s; both must be recorded on the same time range.`,
      );
  }
  const method = options.model.method ?? (response ? 'reconvolution' : 'tail');
  const model: DecayModel = { ...options.model, method };
  if (decays.some((decay) => decay.concentration === null))
    warnings.push(
      'Some decays have no quencher concentration in their header; give it here before the lifetimes go to a study.',
    );
  const inputs = new Map<number, DecayInput>();
  const fits = new Map<number, DecayFit>();
  const outcomes: DecayOutcome[] = decays.map((decay, index) => {
    const base = { index, label: decay.header, concentration: decay.concentration };
    if (channelWidth === null) return { ...base, fit: null, lifetime: null, problem: null };
    const input: DecayInput = { counts: decay.counts, channelWidth, response: response?.counts ?? null };
    // A kept set draws its curves from the stored parameters: no second fit, the same numbers.
    const kept = stored?.[index];
    if (kept) {
      if (kept.fit) {
        inputs.set(index, input);
        fits.set(index, kept.fit as DecayFit);
      }
      return kept;
    }
    try {
      const fit = fitDecay(input, {
        components: model.components,
        method,
        estimator: model.estimator,
        ...(model.startChannel !== null ? { startChannel: model.startChannel } : {}),
        ...(model.endChannel !== null ? { endChannel: model.endChannel } : {}),
        ...(options.countRate !== null ? { countRate: options.countRate } : {}),
        ...(options.repetitionRate !== null ? { repetitionRate: options.repetitionRate } : {}),
      });
      inputs.set(index, input);
      fits.set(index, fit);
      return { ...base, fit, lifetime: lifetimeOf(fit), problem: null };
    } catch (error) {
      if (error instanceof EngineError) return { ...base, fit: null, lifetime: null, problem: error.message };
      throw error;
    }
  });
  const shownIndex = Math.min(options.show, Math.max(0, decays.length - 1));
  const shownDecay = decays[shownIndex];
  const shownFit = fits.get(shownIndex);
  const curves = shownFit ? decayCurves(inputs.get(shownIndex)!, shownFit) : null;
  const factor = timeUnit ? TIME_UNITS[timeUnit] : 1;
  return {
    summary: {
      format: table.format,
      timeHeader: table.timeHeader,
      timeUnit,
      channelWidth,
      channels: table.time.length,
      columns: columns.map(({ column, header, role, concentration }) => ({ column, header, role, concentration })),
      responseSource: response?.source ?? null,
      warnings,
    },
    model,
    outcomes,
    shown: shownDecay
      ? {
          index: shownIndex,
          label: shownDecay.header,
          time: table.time.map((t) => t * factor),
          counts: shownDecay.counts,
          response: response?.counts ?? null,
          model: curves?.model ?? null,
          weightedResiduals: curves?.weightedResiduals ?? null,
          autocorrelation: curves?.autocorrelation ?? null,
          startChannel: shownFit?.startChannel ?? null,
        }
      : null,
    questions,
  };
}
