import { Matrix, solve } from 'ml-matrix';
import { korenPointInto, TUBE_CATALOG, type ResolvedDesign, type TriodePoint } from '@sigmatail/engine';

/**
 * The straightforward way to evaluate one sample, kept as the speed baseline: build the node
 * matrix of the cap-coupled stage and solve it with ml-matrix's general LU routine; with a DC
 * point per sample, Newton iterations on the 4-node DC equations each build the Jacobian and solve
 * it the same way. Nodes: plate 1, plate 2, cathode K, junction J (grids return to J).
 * Returns per sample a11 (so the bench can compare it with the kernel).
 */
export function createBaselineStage(design: ResolvedDesign, dcPerSample: boolean) {
  const tube = TUBE_CATALOG[design.tube.type].model;
  const bPlus = design.supply.bPlus;
  const vt = design.supply.tail;
  const t1: TriodePoint = { ia: 0, gm: 0, ga: 0 };
  const t2: TriodePoint = { ia: 0, gm: 0, ga: 0 };

  /** DC point by Newton from x0 = [vp1, vp2, vk, vj]; leaves t1/t2 at the solution. */
  function solveDc(x0: number[], x: Float64Array, inputs: readonly Float64Array[], s: number): number[] {
    const [rl1, rl2, rk, rt] = [x[0], x[1], x[2], x[3]];
    const [mu1, mu2, perv1, perv2] = [inputs[9][s], inputs[10][s], inputs[11][s], inputs[12][s]];
    const v = [...x0];
    for (let it = 0; it < 50; it++) {
      korenPointInto(tube, v[0] - v[2], v[3] - v[2], perv1, mu1, t1);
      korenPointInto(tube, v[1] - v[2], v[3] - v[2], perv2, mu2, t2);
      const f = [
        (bPlus - v[0]) / rl1 - t1.ia,
        (bPlus - v[1]) / rl2 - t2.ia,
        t1.ia + t2.ia - (v[2] - v[3]) / rk,
        (v[2] - v[3]) / rk - (v[3] - vt) / rt,
      ];
      const j = new Matrix([
        [-1 / rl1 - t1.ga, 0, t1.ga + t1.gm, -t1.gm],
        [0, -1 / rl2 - t2.ga, t2.ga + t2.gm, -t2.gm],
        [t1.ga, t2.ga, -t1.ga - t1.gm - t2.ga - t2.gm - 1 / rk, t1.gm + t2.gm + 1 / rk],
        [0, 0, 1 / rk, -1 / rk - 1 / rt],
      ]);
      const dx = solve(j, Matrix.columnVector(f.map((y) => -y)));
      let worst = 0;
      for (let i = 0; i < 4; i++) {
        v[i] += dx.get(i, 0);
        worst = Math.max(worst, Math.abs(dx.get(i, 0)));
      }
      if (worst < 1e-9) break;
    }
    return v;
  }

  return {
    /** Evaluates samples 0..n-1 (inputs in the kernel's INPUTS order); writes a11 into out. */
    evaluate(inputs: readonly Float64Array[], n: number, out: Float64Array, nominalDc: number[]): void {
      const x = new Float64Array(13);
      korenPointInto(tube, nominalDc[0] - nominalDc[2], nominalDc[3] - nominalDc[2], 1, 1, t1);
      const nom1 = { ...t1 };
      korenPointInto(tube, nominalDc[1] - nominalDc[2], nominalDc[3] - nominalDc[2], 1, 1, t2);
      const nom2 = { ...t2 };
      for (let s = 0; s < n; s++) {
        for (let i = 0; i < 13; i++) x[i] = inputs[i][s];
        let g1: TriodePoint;
        let g2: TriodePoint;
        if (dcPerSample) {
          solveDc(nominalDc, x, inputs, s);
          g1 = t1;
          g2 = t2;
        } else {
          const ga1 = nom1.ga * x[11];
          const ga2 = nom2.ga * x[12];
          g1 = { ia: nom1.ia, ga: ga1, gm: (nom1.gm / nom1.ga) * x[9] * ga1 };
          g2 = { ia: nom2.ia, ga: ga2, gm: (nom2.gm / nom2.ga) * x[10] * ga2 };
        }
        const [rl1, rl2, rk, rt, rg1, rg2, rload1, rload2] = x;
        const y = new Matrix([
          [1 / rl1 + 1 / rload1 + g1.ga, 0, -(g1.gm + g1.ga), 0],
          [0, 1 / rl2 + 1 / rload2 + g2.ga, -(g2.gm + g2.ga), 0],
          [-g1.ga, -g2.ga, g1.gm + g1.ga + g2.gm + g2.ga + 1 / rk, -1 / rk],
          [0, 0, -1 / rk, 1 / rk + 1 / rt + 1 / rg1 + 1 / rg2],
        ]);
        // Right-hand sides for (vg1, vg2) = (1, 0) and (0, 1).
        const rhs = new Matrix([
          [-g1.gm, 0],
          [0, -g2.gm],
          [g1.gm, g2.gm],
          [1 / rg1, 1 / rg2],
        ]);
        const v = solve(y, rhs);
        out[s] = v.get(0, 0);
      }
    },
  };
}
