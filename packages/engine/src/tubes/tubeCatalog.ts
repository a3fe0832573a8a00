import type { KorenParams } from './korenTriode.js';
import type { TubeType } from './tubeTypes.js';

/** A number with where it came from. */
export interface Sourced<T = number> {
  value: T;
  source: string;
}

/** Datasheet typical operating point of one section (V, A, S, Ω). */
export interface TypicalPoint {
  va: number;
  vg: number;
  ia: number;
  gm: number;
  rp: number;
  mu: number;
  source: string;
}

/** Everything the engine knows about one dual-triode type. */
export interface TubeSpec {
  type: TubeType;
  /** Koren model parameters, per section. */
  model: KorenParams & { source: string };
  typical: TypicalPoint;
  /** Maximum plate dissipation per section (W). */
  maxPlateDissipation: Sourced;
  /** Maximum plate voltage (V). */
  maxPlateVoltage: Sourced;
  /** Maximum heater–cathode voltage, either polarity (V). */
  maxHeaterCathode: Sourced;
  /** Interelectrode capacitances per section (F): grid–plate, input (grid to cathode+heater), output. */
  capacitance: { cgp: number; cin: number; cout: number; source: string };
}

const KOREN = 'Koren 1996 parameter set (published list), from memory';
const FITTED = (ex: number, kp: number) =>
  `mu and kg1 fitted here to the datasheet typical Ia and gm, ex = ${ex} and kp = ${kp} taken from the ` +
  'published sets of similar tubes, kvb = 300';
const RCA = (t: string) => `${t} datasheet (RCA/GE receiving-tube family), from memory`;

/**
 * The dual-triode catalog: model parameters, a datasheet typical point, maximum ratings and
 * interelectrode capacitances, each with its source. Values marked "from memory" were recalled,
 * not checked against a document at hand; the typical points are checked against the model in tests.
 *
 * @example
 * TUBE_CATALOG['12AX7'].typical.ia; // 1.2e-3 A at 250 V, −2 V
 */
export const TUBE_CATALOG: Record<TubeType, TubeSpec> = {
  '12AX7': {
    type: '12AX7',
    model: {
      ...{ mu: 100, ex: 1.4, kg1: 1060, kp: 600, kvb: 300 },
      source: 'Koren 1996 parameter set (published list); reproduces a published worked example',
    },
    typical: { va: 250, vg: -2, ia: 1.2e-3, gm: 1.6e-3, rp: 62.5e3, mu: 100, source: RCA('12AX7') },
    maxPlateDissipation: { value: 1.0, source: RCA('12AX7') },
    maxPlateVoltage: { value: 330, source: RCA('12AX7') + ' (design-maximum)' },
    maxHeaterCathode: { value: 180, source: RCA('12AX7') + ' (design-maximum)' },
    capacitance: { cgp: 1.7e-12, cin: 1.6e-12, cout: 0.46e-12, source: RCA('12AX7') },
  },
  '12AT7': {
    type: '12AT7',
    model: { mu: 60, ex: 1.35, kg1: 460, kp: 300, kvb: 300, source: KOREN },
    typical: { va: 250, vg: -2, ia: 10e-3, gm: 5.5e-3, rp: 10.9e3, mu: 60, source: RCA('12AT7') },
    maxPlateDissipation: { value: 2.5, source: RCA('12AT7') },
    maxPlateVoltage: { value: 330, source: RCA('12AT7') + ' (design-maximum)' },
    maxHeaterCathode: { value: 200, source: RCA('12AT7') + ' (design-maximum)' },
    capacitance: { cgp: 1.5e-12, cin: 2.2e-12, cout: 0.5e-12, source: RCA('12AT7') },
  },
  '12AU7': {
    type: '12AU7',
    model: { mu: 21.5, ex: 1.3, kg1: 1180, kp: 84, kvb: 300, source: KOREN },
    typical: { va: 250, vg: -8.5, ia: 10.5e-3, gm: 2.2e-3, rp: 7.7e3, mu: 17, source: RCA('12AU7') },
    maxPlateDissipation: { value: 2.75, source: RCA('12AU7') },
    maxPlateVoltage: { value: 330, source: RCA('12AU7') + ' (design-maximum)' },
    maxHeaterCathode: { value: 200, source: RCA('12AU7') + ' (design-maximum)' },
    capacitance: { cgp: 1.5e-12, cin: 1.6e-12, cout: 0.5e-12, source: RCA('12AU7') },
  },
  '12AY7': {
    type: '12AY7',
    model: { mu: 40.6, ex: 1.4, kg1: 2048, kp: 300, kvb: 300, source: FITTED(1.4, 300) },
    typical: { va: 250, vg: -4, ia: 3e-3, gm: 1.75e-3, rp: 25e3, mu: 44, source: RCA('12AY7') },
    maxPlateDissipation: { value: 1.5, source: RCA('12AY7') },
    maxPlateVoltage: { value: 300, source: RCA('12AY7') },
    maxHeaterCathode: { value: 90, source: RCA('12AY7') },
    capacitance: { cgp: 1.3e-12, cin: 1.3e-12, cout: 0.6e-12, source: RCA('12AY7') },
  },
  '12BH7': {
    type: '12BH7',
    model: { mu: 20.3, ex: 1.3, kg1: 767, kp: 84, kvb: 300, source: FITTED(1.3, 84) },
    typical: { va: 250, vg: -10.5, ia: 11.5e-3, gm: 3.1e-3, rp: 5.3e3, mu: 16.5, source: RCA('12BH7') },
    maxPlateDissipation: { value: 3.5, source: RCA('12BH7') },
    maxPlateVoltage: { value: 300, source: RCA('12BH7') },
    maxHeaterCathode: { value: 200, source: RCA('12BH7') },
    capacitance: { cgp: 2.6e-12, cin: 3.2e-12, cout: 0.5e-12, source: RCA('12BH7') },
  },
  '6SN7': {
    type: '6SN7',
    model: { mu: 27.6, ex: 1.3, kg1: 785, kp: 84, kvb: 300, source: FITTED(1.3, 84) },
    typical: {
      ...{ va: 250, vg: -8, ia: 9e-3, gm: 2.6e-3, rp: 7.7e3, mu: 20 },
      source:
        '6SN7GT class A1 typical operation, checked against a public encyclopedia entry for the 6SN7 family',
    },
    maxPlateDissipation: { value: 5.0, source: RCA('6SN7GTB') },
    maxPlateVoltage: { value: 450, source: RCA('6SN7GTB') },
    maxHeaterCathode: { value: 200, source: RCA('6SN7GTB') },
    capacitance: { cgp: 3.8e-12, cin: 3.0e-12, cout: 1.2e-12, source: RCA('6SN7GTB') },
  },
};
