import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const folder = fileURLToPath(new URL('../../../fixtures/nist-strd/', import.meta.url));

/** Reads a NIST StRD CSV fixture (header x,y) into two arrays. */
export function readNistSeries(name: string): { x: number[]; y: number[] } {
  const lines = readFileSync(`${folder}${name}.csv`, 'utf8').trim().split('\n').slice(1);
  const x: number[] = [];
  const y: number[] = [];
  for (const line of lines) {
    const [xs, ys] = line.split(',');
    x.push(Number(xs));
    y.push(Number(ys));
  }
  return { x, y };
}

interface CertifiedParameter {
  name: string;
  estimate: number;
  sd: number;
}
interface CertifiedDataset {
  parameters: CertifiedParameter[];
  residual_sd: number;
  r_squared: number;
  anova: { residual: { sum_of_squares: number } };
}

/** Certified values for one NIST StRD dataset from certified.json. */
export function readCertified(name: string): CertifiedDataset {
  const all = JSON.parse(readFileSync(`${folder}certified.json`, 'utf8')) as {
    datasets: Record<string, CertifiedDataset>;
  };
  const dataset = all.datasets[name];
  if (!dataset) throw new Error(`no certified values for ${name}`);
  return dataset;
}
