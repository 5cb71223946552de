import { spectrumMatrixOptionsSchema } from '@shared/schemas/spectrum-matrices';
import { seededRandom } from '../lib/seeded-random';
import { MechanismFile, SpectrumMatrix } from '../models';
import { readSpectrumMatrix } from '../services/mechanism/read-spectrum-matrix';
import { DEFAULT_UPLOAD_LIMITS } from '../services/studies/parse/upload-limits';
import { keepDemoFile, keptWithStudy, type DemoStudySeed } from './demo-files';

/*
 * The demo's emission spectrum matrix: INVENTED emission of the iridium emitter with the amine,
 * its band at 520 nm quenched with K_SV = 1600 M^-1 (as the series of the study it is kept with, the amine dilution study) and an exciplex band
 * at 610 nm growing as 1600[Q]/(1 + 1600[Q]), 2 nm grid from 470 to 680 nm, noise from a fixed
 * seed. Every number is made up; nothing here is a measurement.
 */
export const demoExciplexFileName = 'demo-emission-with-exciplex.csv';
const K_SV = 1600; // M^-1
const CONCENTRATIONS_MM = [0, 0, 0.5, 1, 2, 3, 4];

function demoFile(): Buffer {
  const uniform = seededRandom(2718);
  const normal = () => Math.sqrt(-2 * Math.log(Math.max(uniform(), 1e-12))) * Math.cos(2 * Math.PI * uniform());
  const band = (nm: number, centre: number, width: number, height: number) =>
    height * Math.exp(-(((nm - centre) / width) ** 2) / 2);
  const lines = [['wavelength (nm)', ...CONCENTRATIONS_MM.map((mM, i) => `Q-amine-3 ${mM} mM (${i + 1})`)].join(',')];
  for (let nm = 470; nm <= 680; nm += 2) {
    const cells = CONCENTRATIONS_MM.map((mM) => {
      const q = mM / 1000;
      const value = band(nm, 520, 20, 1000) / (1 + K_SV * q) + (band(nm, 610, 28, 500) * K_SV * q) / (1 + K_SV * q);
      return (value + 4 * normal()).toFixed(2);
    });
    lines.push([nm, ...cells].join(','));
  }
  return Buffer.from(`${lines.join('\n')}\n`);
}

/** Keeps the invented matrix with the study (the file on its row), read and analysed as an upload would be. */
export async function seedDemoExciplex(seed: DemoStudySeed): Promise<void> {
  const { transaction, lab, owner, study, clock } = seed;
  const bytes = demoFile();
  const options = spectrumMatrixOptionsSchema.parse({});
  const outcome = await readSpectrumMatrix({
    fileName: demoExciplexFileName,
    bytes,
    options,
    limits: DEFAULT_UPLOAD_LIMITS,
  });
  if (outcome.kind !== 'read' || !outcome.analysis.flags.some((flag) => flag.code === 'NEW_COMPONENT_GROWS'))
    throw new Error(`The demo spectrum matrix does not show its exciplex: ${JSON.stringify(outcome).slice(0, 300)}`);
  const file = await keepDemoFile(MechanismFile, seed, demoExciplexFileName, bytes);
  const matrix = await SpectrumMatrix.create(
    {
      ...keptWithStudy(seed),
      fileId: file.id,
      title: demoExciplexFileName,
      bandWidth: options.bandWidth,
      reading: outcome.reading,
      analysis: outcome.analysis,
      plot: outcome.plot,
    },
    { transaction },
  );
  clock.record({ userId: owner.id, ip: null }, 'spectrum_matrix_kept', lab.id, study.id, {
    spectrumMatrixId: matrix.id,
    file,
    bandWidth: options.bandWidth,
    flags: outcome.analysis.flags.map((flag) => flag.code),
  });
}
