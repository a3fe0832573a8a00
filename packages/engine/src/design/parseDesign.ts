import {
  CAPACITOR_PARTS,
  designSchema,
  RESISTOR_PARTS,
  SPLIT_LOAD_UNUSED_PARTS,
  type PartName,
  type Design,
  type Part,
  type ResolvedDesign,
  type ResolvedPart,
} from './designSchema.js';
import { parseValue, type ValueKind } from '../values/parseValue.js';
import { migrateDesign } from './migrateDesign.js';

/** One validation problem: a dotted path to the field and what is wrong with it. */
export interface DesignIssue {
  path: string;
  message: string;
}

/** Outcome of {@link parseDesign}. */
export type ParseDesignResult = { ok: true; design: ResolvedDesign } | { ok: false; errors: DesignIssue[] };

/**
 * Validates an unknown value (parsed JSON) as a design document and resolves every part value
 * to ohms (resistors) or farads (capacitors). Older document versions are migrated first
 * (see migrateDesign). Never throws: every problem comes back with the path of the field it concerns.
 *
 * @example
 * const r = parseDesign(JSON.parse(text));
 * if (r.ok) console.log(r.design.parts.rl1.value); // e.g. 100000 (Ω)
 * else console.log(r.errors); // [{ path: 'parts.rk.tolerance', message: 'must be below 100 %' }]
 */
export function parseDesign(input: unknown): ParseDesignResult {
  const parsed = designSchema.safeParse(migrateDesign(input));
  if (!parsed.success) {
    const errors = parsed.error.issues.map((i) => ({
      path: i.path.map(String).join('.') || '(document)',
      message: i.message,
    }));
    return { ok: false, errors };
  }
  return { ok: true, design: resolveDesign(parsed.data) };
}

function resolvePart(part: Part, kind: ValueKind = 'resistance'): ResolvedPart {
  const v = part.value;
  // The schema already refused unparseable text, so this cannot fail here.
  const value = typeof v === 'number' ? v : (parseValue(v, kind) as { value: number }).value;
  return { ...part, value };
}

function resolveDesign(d: Design): ResolvedDesign {
  const p = d.parts;
  // Resistors in document order (RL2 and RG2 absent only in a split-load design): the order of
  // the parts fixes which random stream each draws from, so it must not move.
  // A split-load document may still carry the pair's section-2 parts (documents saved before
  // they became optional): they are in no circuit node, so they are dropped here rather than
  // drawn, priced by a plan or listed with zero influence.
  const unused: readonly PartName[] = d.topology === 'split-load' ? SPLIT_LOAD_UNUSED_PARTS : [];
  const parts = {} as ResolvedDesign['parts'];
  for (const name of RESISTOR_PARTS) {
    const r = p[name];
    if (r && !unused.includes(name)) parts[name] = resolvePart(r);
  }
  for (const name of CAPACITOR_PARTS) {
    const c = p[name];
    if (c && !unused.includes(name)) parts[name] = resolvePart(c, 'capacitance');
  }
  return { ...d, parts };
}
