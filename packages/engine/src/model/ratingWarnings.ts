import type { TubeSpec } from '../tubes/tubeCatalog.js';
import type { MetricValues } from './stagePoint.js';

/** A rating or operating-point warning, machine-readable with a one-line message. */
export interface StageWarning {
  code: 'plate-dissipation' | 'plate-voltage' | 'heater-cathode' | 'supply-above-plate-rating';
  message: string;
}

const fmt = (x: number, d = 3) => Number(x.toPrecision(d));

/**
 * Compares a nominal point with the tube's published maximum ratings: plate dissipation
 * Ia·(Va − Vk) per section, plate-to-cathode voltage, heater–cathode voltage (heater at the
 * design's heater potential, ground by default), and B+ against the plate-voltage rating
 * (a cut-off section sees the full B+ on its plate).
 *
 * @example
 * ratingWarnings(TUBE_CATALOG['12AX7'], metrics, 400); // [{ code: 'supply-above-plate-rating', … }]
 */
export function ratingWarnings(tube: TubeSpec, m: MetricValues, bPlus: number): StageWarning[] {
  const w: StageWarning[] = [];
  const pdMax = tube.maxPlateDissipation.value;
  for (const [pd, s] of [
    [m.pd1, 1],
    [m.pd2, 2],
  ] as const) {
    if (pd > pdMax)
      w.push({
        code: 'plate-dissipation',
        message: `section ${s} dissipates ${fmt(pd)} W, above the ${tube.type} rating of ${pdMax} W`,
      });
  }
  const vaMax = tube.maxPlateVoltage.value;
  for (const [va, s] of [
    [m.va1 - m.vk, 1],
    [m.va2 - m.vk, 2],
  ] as const) {
    if (va > vaMax)
      w.push({
        code: 'plate-voltage',
        message: `section ${s} plate sits at ${fmt(va)} V, above the ${tube.type} rating of ${vaMax} V`,
      });
  }
  if (bPlus > vaMax)
    w.push({
      code: 'supply-above-plate-rating',
      message: `B+ of ${bPlus} V exceeds the ${tube.type} plate-voltage rating of ${vaMax} V (reached at warm-up or cut-off)`,
    });
  const hkMax = tube.maxHeaterCathode.value;
  if (Math.abs(m.vhk) > hkMax)
    w.push({
      code: 'heater-cathode',
      message: `heater–cathode voltage ${fmt(m.vhk)} V exceeds the ${tube.type} rating of ±${hkMax} V`,
    });
  return w;
}
