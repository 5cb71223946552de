import { formatNumber, UNITS } from '@shared/format';
import { toMillimolar } from '@shared/units/units';
import { chartColours } from '@/components/chart-theme';
import { lineSeries } from '@/components/scatter-chart';

/**
 * From glow (no quencher) to ink (the most), so the eye reads [Q] from the colour of a spectrum:
 * hex #rrggbb mixed channel by channel. `share` is [Q] over the highest [Q] of the set (0..1).
 */
function concentrationColour(share: number): string {
  const channel = (hex: string, k: number) => parseInt(hex.slice(1 + 2 * k, 3 + 2 * k), 16);
  const [from, to] = [chartColours.points, chartColours.line];
  const mixed = [0, 1, 2].map((k) => Math.round(channel(from, k) + (channel(to, k) - channel(from, k)) * share));
  return `rgb(${mixed.join(', ')})`;
}

/** One line per spectrum, labelled with its [Q] in mM and coloured by it; `valuesOf` gives a spectrum's values on `wavelengths`. */
export function linesByConcentration<S extends { concentration: number }>(
  wavelengths: number[],
  spectra: S[],
  valuesOf: (spectrum: S) => number[],
) {
  const highest = Math.max(...spectra.map((spectrum) => spectrum.concentration)) || 1;
  return spectra.map((spectrum) => {
    const colour = concentrationColour(spectrum.concentration / highest);
    const values = valuesOf(spectrum);
    return {
      ...lineSeries(
        `${formatNumber(toMillimolar(spectrum.concentration), 3)} ${UNITS.millimolar}`,
        wavelengths.map((x, k) => ({ x, y: values[k]! })),
        colour,
        1.5,
      ),
      backgroundColor: colour,
    };
  });
}
