import { korenPointInto, type KorenParams, type TriodePoint } from '../tubes/korenTriode.js';

/** What a tube lot measured per section, at a stated test point. */
export type SectionMeasurement =
  { quantity: 'ia-gm'; ia: number; gm: number } | { quantity: 'mu-rp'; mu: number; rp: number };

/** Test point of a tube lot: plate-cathode and grid-cathode volts. */
export type TestPoint = { va: number; vg: number };

/** The two spread multipliers the engine samples per section (nominal 1 each). */
export type SectionMultipliers = { perv: number; mu: number };

const LOW = 0.05;
const HIGH = 20;

/**
 * Converts one section's measurement into the multipliers the tube spread samples: `perv`
 * multiplies the Koren current (so Ia, gm and 1/rp at a fixed bias), `mu` multiplies the model's
 * mu. The current scale cancels in gm/Ia and in gm·rp, so the mu multiplier is found first by
 * bisection on that ratio (monotone in mu over 0.05..20), then the current scale from Ia (or 1/rp).
 * Volts, amperes, siemens, ohms. Throws RangeError when the measurement is outside what the
 * model can reach at that test point.
 *
 * @example sectionMultipliers(TUBE_CATALOG['12AX7'].model, { va: 250, vg: -2 }, { quantity: 'ia-gm', ia: 1.2e-3, gm: 1.6e-3 })
 */
export function sectionMultipliers(
  model: KorenParams,
  at: TestPoint,
  m: SectionMeasurement,
): SectionMultipliers {
  const pt: TriodePoint = { ia: 0, gm: 0, ga: 0 };
  const point = (mu: number) => korenPointInto(model, at.va, at.vg, 1, mu, pt);
  // gm/Ia rises with mu (the section conducts less deep in its curve); gm/ga is the point's mu.
  const ratio =
    m.quantity === 'ia-gm'
      ? (mu: number) => (point(mu), pt.gm / pt.ia)
      : (mu: number) => (point(mu), pt.gm / pt.ga);
  const target = m.quantity === 'ia-gm' ? m.gm / m.ia : m.mu;
  if (!(target > 0 && Number.isFinite(target))) throw new RangeError('measurement must be positive');
  let lo = LOW;
  let hi = HIGH;
  const rising = ratio(hi) > ratio(lo);
  if (!((target - ratio(lo)) * (target - ratio(hi)) <= 0)) {
    throw new RangeError(
      m.quantity === 'ia-gm'
        ? `gm/Ia = ${target.toPrecision(3)} /V cannot be reached by this tube type at Va ${at.va} V, Vg ${at.vg} V`
        : `mu = ${target.toPrecision(3)} cannot be reached by this tube type at Va ${at.va} V, Vg ${at.vg} V`,
    );
  }
  for (let i = 0; i < 80; i++) {
    const mid = Math.sqrt(lo * hi);
    if (ratio(mid) < target === rising) lo = mid;
    else hi = mid;
  }
  const mu = Math.sqrt(lo * hi);
  point(mu);
  const perv = m.quantity === 'ia-gm' ? m.ia / pt.ia : 1 / (m.rp * pt.ga);
  return { perv, mu };
}
