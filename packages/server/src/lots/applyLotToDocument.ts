import type { ResistorLotData, TubeLotData } from '@sigmatail/db';
import { formatEngineering, parseValue, RESISTOR_PARTS } from '@sigmatail/engine';
import { HttpError } from '../http/httpError.js';
import type { LotRow } from './lotsRepo.js';

/** Part names a resistor lot can be applied to, or 'tube' for a tube lot. */
export const LOT_TARGETS = [...RESISTOR_PARTS, 'tube'] as const;
export type LotTarget = (typeof LOT_TARGETS)[number];

type Doc = Record<string, unknown> & {
  parts?: Record<string, Record<string, unknown> | undefined>;
  tube?: { type?: string; spread?: Record<string, unknown> };
};

/**
 * The design document with the lot's values embedded: a part's spread becomes the empirical
 * spread of the lot's values, or the tube spread gets the lot's whole tubes. The lot's id and
 * name ride along as an annotation; the document version is unchanged (the fields are optional).
 * Throws 400 naming `target` when the lot does not fit that place of the design.
 */
export function applyLotToDocument(
  document: unknown,
  lot: LotRow,
  target: LotTarget,
): { document: Doc; warnings: string[] } {
  const doc = structuredClone(document) as Doc;
  const ref = { id: lot.id, name: lot.name };
  if (lot.kind === 'resistor') {
    if (target === 'tube')
      throw new HttpError(400, 'target: a resistor lot goes on a part, not the tubes', 'target');
    const part = doc.parts?.[target];
    if (!part) throw new HttpError(400, `target: this design has no part ${target}`, 'target');
    const values = (lot.data as ResistorLotData).values;
    part.spread = { kind: 'empirical', values, lot: ref };
    return { document: doc, warnings: nominalWarning(part.value, values, target) };
  }
  if (target !== 'tube')
    throw new HttpError(400, 'target: a tube lot goes on the tubes, not a part', 'target');
  if (doc.tube?.type !== lot.tubeType) {
    throw new HttpError(
      400,
      `target: this lot measured ${lot.tubeType} tubes; the design uses ${doc.tube?.type ?? 'no tube'}`,
      'target',
    );
  }
  const tubes = (lot.data as TubeLotData).multipliers;
  doc.tube.spread = { ...doc.tube.spread, lot: { ...ref, tubes } };
  return { document: doc, warnings: tubeWarnings(tubes) };
}

/** Median multipliers far from 1: the lot's tubes are not what the catalog model describes. */
function tubeWarnings(tubes: number[][]): string[] {
  const median = (c: number) => {
    const v = tubes.flatMap((t) => [t[c]!, t[c + 1]!]).sort((a, b) => a - b);
    return v[Math.floor(v.length / 2)]!;
  };
  const out: string[] = [];
  for (const [c, what] of [
    [0, 'current scale (perveance)'],
    [2, 'mu'],
  ] as const) {
    const off = median(c) - 1;
    if (Math.abs(off) > 0.25) {
      out.push(
        `the lot's median ${what} is ${Math.round(Math.abs(off) * 100)} % ${off > 0 ? 'above' : 'below'} the catalog model's; runs now use the lot's tubes`,
      );
    }
  }
  return out;
}

/**
 * The lot replaces the part's value entirely (the empirical spread ignores the nominal), so a lot
 * whose median is far from the part's nominal is most likely the wrong lot: say so.
 */
function nominalWarning(value: unknown, values: number[], target: string): string[] {
  const parsed =
    typeof value === 'number' ? { ok: true as const, value } : parseValue(String(value), 'resistance');
  if (!parsed.ok) return [];
  const sorted = [...values].sort((a, b) => a - b);
  const median = sorted[Math.floor(sorted.length / 2)]!;
  const off = median / parsed.value - 1;
  if (Math.abs(off) <= 0.2) return [];
  return [
    `the lot's median ${formatEngineering(median, 'resistance')} is ${Math.round(Math.abs(off) * 100)} % ${off > 0 ? 'above' : 'below'} ${target}'s nominal ${formatEngineering(parsed.value, 'resistance')}; runs now use the lot's values`,
  ];
}
