import type { Kernel } from './sampleModel.js';

/**
 * Test kernel: y = Σ w_i·(x_i − 1)/c_i, plus 'valid' = 1. Inputs are parts with nominal 1 (the
 * spreads are relative), so (x − 1)/c maps a part's draw back to a standard variable.
 *
 * @example additiveKernel([0.01, 0.01]) // y = (x1 − 1)/0.01 + (x2 − 1)/0.01
 */
export function additiveKernel(
  scales: readonly number[],
  weights: readonly number[] = scales.map(() => 1),
): Kernel {
  const inputs = scales.map((_s, i) => `x${i + 1}`);
  return {
    inputs,
    metrics: ['y', 'valid'],
    nominalInputs: () => new Float64Array(scales.length).fill(1),
    evaluate(x, n, out) {
      const y = out[0];
      for (let s = 0; s < n; s++) {
        let acc = 0;
        for (let i = 0; i < scales.length; i++) acc += (weights[i] * (x[i][s] - 1)) / scales[i];
        y[s] = acc;
        out[1][s] = 1;
      }
    },
  };
}

/**
 * Ishigami function y = sin X1 + a·sin² X2 + b·X3⁴·sin X1 with X_i uniform on [−π, π]. Inputs are
 * parts with nominal 1 and a ±50 % uniform spread: X = (x − 1)·2π.
 */
export function ishigamiKernel(a = 7, b = 0.1): Kernel {
  return {
    inputs: ['x1', 'x2', 'x3'],
    metrics: ['y'],
    nominalInputs: () => new Float64Array(3).fill(1),
    evaluate(x, n, out) {
      for (let s = 0; s < n; s++) {
        const x1 = (x[0][s] - 1) * 2 * Math.PI;
        const x2 = (x[1][s] - 1) * 2 * Math.PI;
        const x3 = (x[2][s] - 1) * 2 * Math.PI;
        const s2 = Math.sin(x2);
        out[0][s] = Math.sin(x1) + a * s2 * s2 + b * x3 ** 4 * Math.sin(x1);
      }
    },
  };
}
