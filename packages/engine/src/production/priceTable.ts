import type { ResistorKind } from '../values/resistorKinds.js';

/**
 * A workspace's prices (any one currency, per piece): resistors by kind and tolerance class
 * (percent), and one dual-triode tube either unmatched or with its two sections matched by the
 * supplier.
 *
 * @example
 * const prices: PriceTable = {
 *   currency: 'EUR',
 *   resistors: [{ kind: 'metal-film', tolerance: 1, price: 0.08 }],
 *   tubes: { unmatched: 14, matched: 19 },
 * };
 */
export type PriceTable = {
  currency: string;
  resistors: { kind: ResistorKind; tolerance: number; price: number }[];
  tubes: { unmatched: number; matched: number };
};

/** A tolerance class a part can be bought in: tolerance in percent, price per piece. */
export type ToleranceClass = { tolerance: number; price: number };

/**
 * The classes offered for one resistor kind, loosest first (descending tolerance). A class listed
 * twice keeps its cheaper price.
 *
 * @example classesFor(prices, 'metal-film') // [{ tolerance: 5, price: 0.03 }, { tolerance: 1, price: 0.08 }]
 */
export function classesFor(prices: PriceTable, kind: ResistorKind): ToleranceClass[] {
  const byTol = new Map<number, number>();
  for (const r of prices.resistors) {
    if (r.kind !== kind) continue;
    const old = byTol.get(r.tolerance);
    byTol.set(r.tolerance, old === undefined ? r.price : Math.min(old, r.price));
  }
  return [...byTol]
    .map(([tolerance, price]) => ({ tolerance, price }))
    .sort((a, b) => b.tolerance - a.tolerance);
}

/**
 * Price of one part bought at `tolerance` percent: the cheapest class at least that tight, or
 * null when the table has none.
 *
 * @example partPrice(prices, 'metal-film', 2) // price of the 2 % class, else of the 1 % class
 */
export function partPrice(prices: PriceTable, kind: ResistorKind, tolerance: number): number | null {
  let best: number | null = null;
  for (const c of classesFor(prices, kind)) {
    if (c.tolerance <= tolerance + 1e-12 && (best === null || c.price < best)) best = c.price;
  }
  return best;
}
