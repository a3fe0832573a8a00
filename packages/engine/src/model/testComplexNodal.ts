import { add as cadd, complex, lusolve, unaryMinus, type Complex as MathComplex } from 'mathjs';

/**
 * Test helper: a modified nodal analysis at one frequency, stamped element by element and solved
 * by mathjs's complex LU (lusolve) — the independent reference the engine's hand-reduced complex
 * solves are checked against. Node −1 is ground.
 *
 * @example
 * const m = complexNodalSystem(3, 1000);
 * m.g(0, 1, 10e3); m.cap(1, -1, 1e-9); m.g(0, -1, 1e6); m.voltageSource(0, 2, 1);
 * m.solve()[1]; // node 1's voltage
 */
export function complexNodalSystem(n: number, f: number) {
  const w = 2 * Math.PI * f;
  const a: MathComplex[][] = Array.from({ length: n }, () => Array.from({ length: n }, () => complex(0, 0)));
  const b: MathComplex[] = Array.from({ length: n }, () => complex(0, 0));
  const add = (i: number, j: number, y: MathComplex) => (a[i][j] = cadd(a[i][j], y));
  const y = (p: number, q: number, val: MathComplex) => {
    add(p, p, val);
    if (q >= 0) {
      add(q, q, val);
      add(p, q, unaryMinus(val));
      add(q, p, unaryMinus(val));
    }
  };
  return {
    a,
    add,
    /** A resistor r (Ω) between p and q. */
    g: (p: number, q: number, r: number) => y(p, q, complex(1 / r, 0)),
    /** A capacitor c (F) between p and q. */
    cap: (p: number, q: number, c: number) => y(p, q, complex(0, w * c)),
    /** A triode's gm·(v_grid − v_cathode) leaving the plate node and entering the cathode node. */
    transconductance: (plate: number, cathode: number, grid: number, gm: number) => {
      add(plate, grid, complex(gm, 0));
      add(plate, cathode, complex(-gm, 0));
      add(cathode, grid, complex(-gm, 0));
      add(cathode, cathode, complex(gm, 0));
    },
    /** An ideal source of `volts` at node p to ground, its current the extra unknown `branch`. */
    voltageSource: (p: number, branch: number, volts: number) => {
      add(p, branch, complex(1, 0));
      add(branch, p, complex(1, 0));
      b[branch] = complex(volts, 0);
    },
    /** The node voltages (and branch currents). */
    solve: (): MathComplex[] => (lusolve(a, b) as unknown as MathComplex[][]).map((row) => complex(row[0])),
  };
}
