import { absorptionOptionsSchema } from '@shared/schemas/absorption-titrations';
import { seededRandom } from '../lib/seeded-random';
import { AbsorptionTitration, MechanismFile } from '../models';
import { readAbsorptionTitration } from '../services/mechanism/read-absorption-titration';
import { DEFAULT_UPLOAD_LIMITS } from '../services/studies/parse/upload-limits';
import { keepDemoFile, keptWithStudy, type DemoStudySeed } from './demo-files';

/*
 * The demo's absorption titration: an INVENTED UV-vis titration of the carbazole emitter with
 * the alkene, made to show a ground-state complex whose association constant matches the static
 * constant of that study's combined fit (K_S = 150 M^-1 there, K_a = 150 M^-1 here). Every
 * number is made up: an emitter band at 345 nm, a complex band to the red at 380 nm, the
 * alkene's own absorbance below 320 nm (given as ε in its own file), 1 nm grid, noise from a
 * fixed seed, so the files are the same on every load. Nothing here is a measurement.
 */
export const demoAbsorptionFileName = 'demo-uv-vis-titration.csv';
export const demoQuencherFileName = 'demo-alkene-epsilon.csv';
const K_A = 150; // M^-1
const EMITTER = 25e-6; // mol/L
const CONCENTRATIONS_MM = [0, 2, 4, 6, 8, 12, 16, 20];
const WAVELENGTHS = Array.from({ length: 181 }, (_, i) => 300 + i);
const NOISE = 0.0008;

const gauss = (nm: number, centre: number, width: number) => Math.exp(-(((nm - centre) / width) ** 2) / 2);
const epsilonEmitter = (nm: number) => 12000 * gauss(nm, 345, 18);
const epsilonQuencher = (nm: number) => 60 * gauss(nm, 300, 12);
const epsilonComplex = (nm: number) => 8000 * gauss(nm, 380, 22);

/** [EQ] of the 1:1 balance with total [E]0 and [Q]0 (the smaller root, written so it does not cancel). */
function complexAt(q: number): number {
  const s = EMITTER + q + 1 / K_A;
  return (2 * EMITTER * q) / (s + Math.sqrt(s * s - 4 * EMITTER * q));
}

function demoFiles(): { titration: Buffer; quencher: Buffer } {
  const uniform = seededRandom(4711);
  const normal = () => Math.sqrt(-2 * Math.log(Math.max(uniform(), 1e-12))) * Math.cos(2 * Math.PI * uniform());
  const rows = WAVELENGTHS.map((nm) =>
    [
      nm,
      ...CONCENTRATIONS_MM.map((mM) => {
        const q = mM / 1000;
        const eq = complexAt(q);
        const value =
          epsilonEmitter(nm) * (EMITTER - eq) + epsilonComplex(nm) * eq + epsilonQuencher(nm) * q + NOISE * normal();
        return value.toFixed(5);
      }),
    ].join(','),
  );
  const header = ['wavelength (nm)', ...CONCENTRATIONS_MM.map((mM) => `Q-ene-6 ${mM} mM`)].join(',');
  const quencher = [
    'wavelength (nm),ε (M-1 cm-1)',
    ...WAVELENGTHS.map((nm) => `${nm},${epsilonQuencher(nm).toFixed(3)}`),
  ];
  return {
    titration: Buffer.from(`${header}\n${rows.join('\n')}\n`),
    quencher: Buffer.from(`${quencher.join('\n')}\n`),
  };
}

/** Keeps the invented titration and the alkene's ε file with the study (files on their rows, as the default store does). */
export async function seedDemoAbsorption(seed: DemoStudySeed): Promise<void> {
  const { transaction, lab, owner, study, clock } = seed;
  const files = demoFiles();
  const options = absorptionOptionsSchema.parse({ emitterConcentration: EMITTER });
  const outcome = await readAbsorptionTitration({
    fileName: demoAbsorptionFileName,
    bytes: files.titration,
    quencher: { fileName: demoQuencherFileName, bytes: files.quencher },
    options,
    limits: DEFAULT_UPLOAD_LIMITS,
  });
  if (outcome.kind !== 'read' || outcome.analysis.flags.length === 0)
    throw new Error(
      `The demo absorption titration does not show its complex: ${JSON.stringify(outcome).slice(0, 300)}`,
    );
  const kept = [
    await keepDemoFile(MechanismFile, seed, demoAbsorptionFileName, files.titration),
    await keepDemoFile(MechanismFile, seed, demoQuencherFileName, files.quencher),
  ];
  const titration = await AbsorptionTitration.create(
    {
      ...keptWithStudy(seed),
      fileId: kept[0]!.id,
      quencherFileId: kept[1]!.id,
      kind: 'absorption',
      title: demoAbsorptionFileName,
      bandWidth: options.bandWidth,
      options,
      reading: outcome.reading,
      analysis: outcome.analysis,
      plot: outcome.plot,
    },
    { transaction },
  );
  clock.record({ userId: owner.id, ip: null }, 'absorption_titration_kept', lab.id, study.id, {
    absorptionTitrationId: titration.id,
    files: kept,
    options,
    flags: outcome.analysis.flags.map((flag) => flag.code),
  });
}
