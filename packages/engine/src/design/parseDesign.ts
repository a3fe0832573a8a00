import {
  CAPACITOR_PARTS,
  designSchema,
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
  const parts: ResolvedDesign['parts'] = {
    rl1: resolvePart(p.rl1),
    rl2: resolvePart(p.rl2),
    rk: resolvePart(p.rk),
    rt: resolvePart(p.rt),
    rg1: resolvePart(p.rg1),
    rg2: resolvePart(p.rg2),
  };
  if (p.rload1) parts.rload1 = resolvePart(p.rload1);
  if (p.rload2) parts.rload2 = resolvePart(p.rload2);
  if (p.rsource) parts.rsource = resolvePart(p.rsource);
  for (const name of CAPACITOR_PARTS) {
    const c = p[name];
    if (c) parts[name] = resolvePart(c, 'capacitance');
  }
  return { ...d, parts };
}
