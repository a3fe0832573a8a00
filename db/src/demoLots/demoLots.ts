import { existsSync, readFileSync } from 'node:fs';
import { TUBE_CATALOG, sectionMultipliers } from '@sigmatail/engine';
import { parse } from 'csv-parse/sync';
import type { LotsTable, ResistorLotData, TubeLotData } from '../schema.js';

/** A demo lot as the seed stores it. */
export type DemoLot = Pick<LotsTable, 'name' | 'kind' | 'quantity' | 'tube_type' | 'file_name' | 'count'> & {
  test_point: { va: number; vg: number } | null;
  data: ResistorLotData | TubeLotData;
};

/** The committed CSVs sit next to this file in src/ (also when running the built dist/). */
function readCsv(file: string): Record<string, string>[] {
  let url = new URL(`./${file}`, import.meta.url);
  if (!existsSync(url)) url = new URL(`../../src/demoLots/${file}`, import.meta.url);
  return parse(readFileSync(url), { columns: true, skip_empty_lines: true, trim: true }) as Record<
    string,
    string
  >[];
}

function resistorLot(name: string, file: string): DemoLot {
  const values = readCsv(file).map((r) => Number(r.value));
  return {
    name,
    kind: 'resistor',
    quantity: 'ohms',
    tube_type: null,
    test_point: null,
    file_name: file,
    count: values.length,
    data: { values },
  };
}

function tubeLot(name: string, file: string): DemoLot {
  const point = { va: 250, vg: -2 };
  const model = TUBE_CATALOG['12AX7'].model;
  const sections = readCsv(file).map((r) => [r.ia1, r.gm1, r.ia2, r.gm2].map(Number));
  const multipliers = sections.map(([ia1, gm1, ia2, gm2]) => {
    const a = sectionMultipliers(model, point, { quantity: 'ia-gm', ia: ia1! / 1e3, gm: gm1! / 1e3 });
    const b = sectionMultipliers(model, point, { quantity: 'ia-gm', ia: ia2! / 1e3, gm: gm2! / 1e3 });
    return [a.perv, b.perv, a.mu, b.mu];
  });
  return {
    name,
    kind: 'tube',
    quantity: 'ia-gm',
    tube_type: '12AX7',
    test_point: point,
    file_name: file,
    count: sections.length,
    data: { sections, multipliers },
  };
}

/**
 * The demo workshop's invented lots (generated once by generateDemoLots.ts): Rk metal film, a
 * binned carbon-film reel for Rt, and incoming 12AX7s measured at 250 V / −2 V.
 */
export function demoLots(): DemoLot[] {
  return [
    resistorLot('Rk 470R 1 % metal film, reel 14', 'rk-470R-metal-film.csv'),
    resistorLot('Rt 10k 5 % carbon, reel 9 (sorted)', 'rt-10k-carbon-binned.csv'),
    tubeLot('12AX7 incoming, box 3', '12ax7-incoming.csv'),
  ];
}
