import type { ResistorLotData, TubeLotData } from '@sigmatail/db';
import { HttpError } from '../http/httpError.js';
import type { LotRow } from './lotsRepo.js';

/** Part names a resistor lot can be applied to, or 'tube' for a tube lot. */
export const LOT_TARGETS = [
  'rl1',
  'rl2',
  'rk',
  'rt',
  'rg1',
  'rg2',
  'rload1',
  'rload2',
  'rsource',
  'tube',
] as const;
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
export function applyLotToDocument(document: unknown, lot: LotRow, target: LotTarget): Doc {
  const doc = structuredClone(document) as Doc;
  const ref = { id: lot.id, name: lot.name };
  if (lot.kind === 'resistor') {
    if (target === 'tube')
      throw new HttpError(400, 'target: a resistor lot goes on a part, not the tubes', 'target');
    const part = doc.parts?.[target];
    if (!part) throw new HttpError(400, `target: this design has no part ${target}`, 'target');
    part.spread = { kind: 'empirical', values: (lot.data as ResistorLotData).values, lot: ref };
    return doc;
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
  doc.tube.spread = { ...doc.tube.spread, lot: { ...ref, tubes: (lot.data as TubeLotData).multipliers } };
  return doc;
}
