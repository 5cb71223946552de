import type { Entry } from 'jcampconverter';
import { readJcampBlocks } from './check-jcamp';
import { concentrationInHeader } from './header-units';
import { ParseProblem } from './parse-problem';
import type { RawTable } from './read-text-table';
import { DEFAULT_UPLOAD_LIMITS, limitMessage, UploadLimitExceeded, type UploadLimits } from './upload-limits';

/** ##XUNITS= values (JCAMP-DX 4.24 spells them out) -> wavelength in nm. */
const TO_NANOMETRES: Record<string, (x: number) => number> = {
  NANOMETERS: (x) => x,
  NM: (x) => x,
  MICROMETERS: (x) => x * 1e3,
  '1/CM': (x) => 1e7 / x, // wavenumber in cm^-1 -> nm
};

/** JCAMP-DX ##CONCENTRATIONS= is written as (NCU) then one "(name, value, unit)" per substance. */
function fromConcentrationsLabel(text: string): number | null {
  const entries = [...text.matchAll(/\(([^,()]*),\s*([^,()]+?)\s*,\s*([^,()]+?)\s*\)/g)];
  // Several substances (emitter and quencher) leave it open which one is [Q]: ask in the mapping instead.
  if (entries.length !== 1) return null;
  const unit = entries[0]![3]!
    .replace(/mol\s*\/\s*L$/i, 'M')
    .replace(/^mmol\s*\/\s*L$/i, 'mM')
    .replace(/^MM$/, 'mM');
  return concentrationInHeader(`${entries[0]![2]} ${unit}`);
}

/**
 * A block's quencher concentration, in this order: its ##TITLE=, ##CONCENTRATIONS= (one
 * substance), ##SAMPLE DESCRIPTION=, or a private label whose name holds "CONC" (e.g.
 * ##$QUENCHER CONCENTRATION= 2 mM). Null when none names one: the user types it in the mapping.
 */
function blockConcentration(entry: Entry): number | null {
  const text = (value: unknown) => (value === undefined || value === null ? '' : String(value));
  const candidates = [
    concentrationInHeader(text(entry.title)),
    fromConcentrationsLabel(text(entry.info.CONCENTRATIONS)),
    concentrationInHeader(text(entry.info.SAMPLEDESCRIPTION)),
    ...Object.entries(entry.meta)
      .filter(([label]) => /CONC/i.test(label))
      .map(([, value]) => concentrationInHeader(text(value))),
  ];
  return candidates.find((value) => value !== null) ?? null;
}

interface Column {
  header: string;
  byWavelength: Map<number, number>;
}

// 15 significant digits drop the float noise of Y x YFACTOR (33.333333 rather than 33.333332999999996).
const cellText = (value: number | undefined) => (value === undefined ? '' : String(Number(value.toPrecision(15))));

function blockColumns(entry: Entry, index: number): Column[] {
  const title = entry.title?.trim() || `spectrum ${index + 1}`;
  return entry.spectra.map((spectrum, page) => {
    const units = String(spectrum.xUnits ?? entry.info.XUNITS ?? '')
      .trim()
      .toUpperCase();
    const toNm = TO_NANOMETRES[units];
    if (!toNm)
      throw new ParseProblem(
        `Block "${title}" has ##XUNITS=${units || ' (none)'}; Halflight reads NANOMETERS, MICROMETERS or 1/CM.`,
      );
    const { x = [], y = [] } = spectrum.data;
    if (x.length === 0 || x.length !== y.length) throw new ParseProblem(`Block "${title}" holds no readable x,y data.`);
    const byWavelength = new Map<number, number>();
    x.forEach((xi, i) => {
      const nm = toNm(xi);
      if (!Number.isFinite(nm) || !Number.isFinite(y[i]!) || nm <= 0)
        throw new ParseProblem(
          `Block "${title}", point ${i + 1}: expected a positive x and a number y, found ${xi}, ${y[i]}.`,
        );
      byWavelength.set(Number(nm.toPrecision(10)), y[i]!);
    });
    const concentration = blockConcentration(entry);
    const name = entry.spectra.length > 1 ? `${title} (page ${page + 1})` : title;
    // The header carries the concentration so the spectrum-matrix mapping reads it as from a CSV header.
    const header =
      concentration !== null && concentrationInHeader(name) === null
        ? `${name} ([Q] ${Number(concentration.toPrecision(6))} M)`
        : name;
    return { header, byWavelength };
  });
}

/**
 * A JCAMP-DX file (IUPAC; one spectrum or a LINK block of several) read with jcampconverter
 * into a spectrum matrix: wavelength in nm, one column per spectrum. Spectra on different
 * grids share one wavelength column; a blank cell then means "not measured there".
 */
export function readJcamp(bytes: Buffer, limits: UploadLimits = DEFAULT_UPLOAD_LIMITS): RawTable {
  const columns = readJcampBlocks(bytes, limits).flatMap(blockColumns);
  if (columns.length === 0)
    throw new ParseProblem('The JCAMP-DX file holds no spectrum (no ##XYDATA= or ##PEAK TABLE= block).');
  if (columns.length > limits.columns)
    throw new UploadLimitExceeded('columns', limitMessage.columns(limits, 1, columns.length + 1));
  const wavelengths = [...new Set(columns.flatMap((column) => [...column.byWavelength.keys()]))].sort((a, b) => a - b);
  if (wavelengths.length > limits.rows) throw new UploadLimitExceeded('rows', limitMessage.rows(limits));
  if (wavelengths.length * (columns.length + 1) > limits.cells)
    throw new UploadLimitExceeded('cells', limitMessage.cells(limits));
  const rows = wavelengths.map((nm, i) => ({
    line: i + 1,
    cells: [String(nm), ...columns.map((column) => cellText(column.byWavelength.get(nm)))],
  }));
  const gaps = rows.some((row) => row.cells.includes(''));
  return {
    headers: ['wavelength (nm)', ...columns.map((column) => column.header)],
    rows,
    decimalComma: false,
    format: `JCAMP-DX, ${columns.length} spectr${columns.length === 1 ? 'um' : 'a'}${gaps ? ' on different wavelength grids' : ''}`,
    layoutHint: 'spectrum',
    blankIsUnmeasured: gaps,
  };
}
