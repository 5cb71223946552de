/**
 * An invented spectrum-matrix CSV for the ingest benchmark: a wavelength column and one
 * emission spectrum per sample with its quencher concentration in the header ("0.125 mM").
 * Every spectrum is the same Gaussian band scaled by 1 / (1 + K_SV [Q]), so the window
 * integrals fall on a Stern–Volmer line with K_SV = INVENTED_K_SV by construction, with
 * small deterministic noise. Demo numbers only.
 */
export const INVENTED_K_SV = 350; // M^-1, invented

/** Deterministic pseudo-random numbers (mulberry32), so every run builds the same bytes. */
function seeded(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = Math.imul(state ^ (state >>> 15), state | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function spectrumMatrixCsv(options: { samples: number; targetBytes: number }): { bytes: Buffer; rows: number } {
  const random = seeded(20261202);
  const concentrationsMm = Array.from({ length: options.samples }, (_, i) => i * 0.025);
  const header = ['wavelength (nm)', ...concentrationsMm.map((c) => `${c.toFixed(3)} mM`)].join(',');
  const scale = concentrationsMm.map((c) => 1 / (1 + INVENTED_K_SV * c * 1e-3));
  const line = (wavelength: number) => {
    const band = 50_000 * Math.exp(-(((wavelength - 600) / 40) ** 2) / 2);
    return [wavelength.toFixed(3), ...scale.map((s) => (band * s * (1 + 1e-4 * (random() - 0.5)) + 1).toFixed(3))].join(
      ',',
    );
  };
  // Estimate the mean row length from rows across the band, then spread the rows evenly over 450–750 nm.
  const sampleLengths = [450, 525, 575, 600, 625, 675, 750].map((wavelength) => line(wavelength).length + 1);
  const rows = Math.max(
    10,
    Math.round(options.targetBytes / (sampleLengths.reduce((sum, length) => sum + length, 0) / sampleLengths.length)),
  );
  const lines = [header];
  for (let i = 0; i < rows; i++) lines.push(line(450 + (300 * i) / (rows - 1)));
  return { bytes: Buffer.from(`${lines.join('\n')}\n`, 'utf8'), rows };
}
