import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { createStream } from '../random/createStream.js';
import { correlation } from '../influence/rankInfluence.js';
import { fillTubeInPlace, prepareTubeSpread, sectionsPaired } from './tubeSpread.js';

const N = 100_000;
function draw(spec: Parameters<typeof prepareTubeSpread>[0], seed = 'tube', N = 100_000) {
  const t = prepareTubeSpread(spec);
  const u = [0, 1, 2, 3].map((j) => {
    const c = new Float64Array(N);
    createStream(seed, j).fillOpen(c, N);
    return c;
  });
  const out = {
    perv1: new Float64Array(N),
    perv2: new Float64Array(N),
    mu1: new Float64Array(N),
    mu2: new Float64Array(N),
  };
  const tally = { samples: 0, draws: 0, failures: 0 };
  fillTubeInPlace(
    t,
    { perv1: u[0], perv2: u[1], mu1: u[2], mu2: u[3] },
    N,
    out,
    createStream(seed, 'redraw'),
    tally,
  );
  return { t, out, tally };
}
const logs = (x: Float64Array) => Float64Array.from(x, Math.log);

describe('tube section spread', () => {
  it('lognormal multipliers with the stated 1σ and a Gaussian copula between sections', () => {
    const { out } = draw({ perveanceSd: 10, muSd: 4, sectionCorrelation: 0.6 });
    const lp = logs(out.perv1);
    const mean = lp.reduce((a, b) => a + b, 0) / N;
    const sd = Math.sqrt(lp.reduce((a, b) => a + (b - mean) ** 2, 0) / N);
    expect(sd / Math.log(1.1)).toBeCloseTo(1, 2);
    // Normal scores of the sections correlate with ρ (copula definition).
    expect(correlation(lp, logs(out.perv2))).toBeCloseTo(0.6, 2);
    expect(correlation(logs(out.mu1), logs(out.mu2))).toBeCloseTo(0.6, 2);
    expect(Math.abs(correlation(lp, logs(out.mu1)))).toBeLessThan(0.02);
  });

  it('pairing redraws envelopes until matched; acceptance rate as expected for a normal ratio', () => {
    const { t, out, tally } = draw({
      perveanceSd: 10,
      muSd: 3,
      sectionCorrelation: 0,
      pairing: { quantity: 'ia', within: 5 },
    });
    for (let s = 0; s < N; s++)
      expect(sectionsPaired(t, out.perv1[s], out.perv2[s], out.mu1[s], out.mu2[s])).toBe(true);
    // ln(p1/p2) ~ N(0, 2·ln(1.1)²): acceptance = P(ln 0.95 ≤ X ≤ ln 1.05) (analytic; Φ from jstat) ≈ 0.29.
    expect(tally.samples).toBe(N);
    expect(tally.failures).toBe(0);
    const sd = Math.SQRT2 * Math.log(1.1);
    const expected = jStat.normal.cdf(Math.log(1.05), 0, sd) - jStat.normal.cdf(Math.log(0.95), 0, sd);
    expect(N / tally.draws).toBeCloseTo(expected, 2);
  });

  it('the same seed gives the same pairs (deterministic rejection)', () => {
    const a = draw(
      { perveanceSd: 10, muSd: 3, sectionCorrelation: 0.3, pairing: { quantity: 'mu', within: 2 } },
      'x',
    );
    const b = draw(
      { perveanceSd: 10, muSd: 3, sectionCorrelation: 0.3, pairing: { quantity: 'mu', within: 2 } },
      'x',
    );
    expect(a.out.mu2).toEqual(b.out.mu2);
    expect(a.tally).toEqual(b.tally);
  });
});
