import FFT from 'fft.js';

/** Harmonic content of one period of a signal: amplitudes and their ratios to the fundamental. */
export interface Harmonics {
  /** Peak amplitudes of the fundamental, 2nd and 3rd harmonics (signal units). */
  h1: number;
  h2: number;
  h3: number;
  /** H2/H1, H3/H1 and THD = sqrt(Σ_{k≥2} Hk²)/H1, in percent. */
  h2Percent: number;
  h3Percent: number;
  thdPercent: number;
  /** The same ratios in dB (20·log10). */
  h2Db: number;
  h3Db: number;
  thdDb: number;
}

/**
 * Harmonics of one period of `y` (n samples, n a power of two ≥ 4, sample k at phase 2πk/n), from
 * the discrete Fourier transform computed by fft.js: Hk = 2·|Yk|/n for 1 ≤ k < n/2. THD sums
 * every harmonic from the 2nd up to n/2 − 1.
 *
 * @example
 * harmonicsOfPeriod(Float64Array.from({ length: 64 }, (_, k) => Math.sin((2 * Math.PI * k) / 64))).h1; // 1
 */
export function harmonicsOfPeriod(y: Float64Array): Harmonics {
  const n = y.length;
  const fft = new FFT(n);
  const spectrum = fft.createComplexArray() as number[];
  fft.realTransform(spectrum, Array.from(y));
  const amp = (k: number) => (2 * Math.hypot(spectrum[2 * k], spectrum[2 * k + 1])) / n;
  const h1 = amp(1);
  let rest = 0;
  for (let k = 2; k < n / 2; k++) rest += amp(k) ** 2;
  const h2 = amp(2);
  const h3 = amp(3);
  const thd = Math.sqrt(rest);
  return {
    ...{ h1, h2, h3 },
    ...{ h2Percent: (100 * h2) / h1, h3Percent: (100 * h3) / h1, thdPercent: (100 * thd) / h1 },
    ...{ h2Db: 20 * Math.log10(h2 / h1), h3Db: 20 * Math.log10(h3 / h1), thdDb: 20 * Math.log10(thd / h1) },
  };
}

/**
 * Harmonics of a static transfer y(x) driven by x = amplitude·sin(θ) over one period (n samples).
 * For y = a·x + b·x², H2/H1 = b·amplitude/(2a) exactly.
 *
 * @example
 * harmonicsOfTransfer((x) => 2 * x + 0.1 * x * x, 1).h2Percent; // 2.5
 */
export function harmonicsOfTransfer(transfer: (x: number) => number, amplitude: number, n = 256): Harmonics {
  const y = new Float64Array(n);
  for (let k = 0; k < n; k++) y[k] = transfer(amplitude * Math.sin((2 * Math.PI * k) / n));
  return harmonicsOfPeriod(y);
}
