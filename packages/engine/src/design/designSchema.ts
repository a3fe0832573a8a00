import { z } from 'zod';
import { TUBE_TYPES } from '../tubes/tubeTypes.js';
import { AC_METRIC_IDS, CORNER_METRIC_IDS, METRIC_IDS } from '../model/metrics.js';
import { MAX_SPREAD_K, MAX_TOLERANCE_PERCENT } from '../limits.js';
import { parseValue } from '../values/parseValue.js';
import { RESISTOR_KINDS, type ResistorKind } from '../values/resistorKinds.js';

const finite = () => z.number().refine(Number.isFinite, 'must be a finite number');
const spreadK = finite().positive().max(MAX_SPREAD_K).optional();

/**
 * Where embedded measured values came from (a stored lot). Informative only: the values are in
 * the document, so a run never depends on the lot still existing.
 *
 * @example lotRefSchema.parse({ id: '5d0c…', name: 'Incoming 100k, March' });
 */
export const lotRefSchema = z.object({
  id: z.string().max(100).optional(),
  name: z.string().min(1).max(200),
});

/**
 * A spread (distribution) of a part value around nominal; tolerance = k·σ where it applies.
 *
 * @example
 * spreadSchema.parse({ kind: 'binned', inner: 1 }); // 5 % parts with the ±1 % ones sorted out
 */
export const spreadSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('normal'), k: spreadK }),
  z.object({ kind: z.literal('uniform') }),
  z.object({ kind: z.literal('truncnormal'), k: spreadK }),
  z.object({ kind: z.literal('binned'), inner: finite().min(0).lt(100), k: spreadK }),
  z.object({ kind: z.literal('lognormal'), k: spreadK }),
  z.object({ kind: z.literal('fixed') }),
  z.object({
    kind: z.literal('empirical'),
    values: z.array(finite().positive()).min(1),
    lot: lotRefSchema.optional(),
  }),
]);

const partValue = z.union([
  finite().positive('must be a positive number of ohms'),
  z.string().refine((s) => parseValue(s, 'resistance').ok, {
    message: 'not a resistance (use ohms, engineering notation like 2.2k, or an RKM code like 4k7)',
  }),
]);

const capValue = z.union([
  finite().positive('must be a positive number of farads'),
  z.string().refine((s) => parseValue(s, 'capacitance').ok, {
    message: 'not a capacitance (use farads, engineering notation like 100n, or an RKM code like 4n7)',
  }),
]);

const tolerance = finite().min(0).lt(MAX_TOLERANCE_PERCENT, `must be below ${MAX_TOLERANCE_PERCENT} %`);

/**
 * A toleranced resistor: value in ohms or as text, tolerance in percent (0 ≤ t < 100).
 *
 * @example
 * partSchema.parse({ value: '4k7', tolerance: 1, spread: { kind: 'normal' } });
 */
export const partSchema = z
  .object({
    value: partValue,
    tolerance,
    spread: spreadSchema,
    /** Construction (prices, ageing); metal film when absent. Optional, so older documents still read. */
    kind: z.enum(RESISTOR_KINDS).optional(),
  })
  .refine((p) => p.spread.kind !== 'binned' || p.spread.inner < p.tolerance, {
    message: 'the sorted-out band must be narrower than the tolerance',
    path: ['spread', 'inner'],
  });

/**
 * A toleranced capacitor (design format 2): value in farads or as text ('100n', '22u', '4n7'),
 * tolerance in percent, spread as for resistors.
 *
 * @example
 * capacitorSchema.parse({ value: '22n', tolerance: 10, spread: { kind: 'normal' } });
 */
export const capacitorSchema = z
  .object({ value: capValue, tolerance, spread: spreadSchema })
  .refine((p) => p.spread.kind !== 'binned' || p.spread.inner < p.tolerance, {
    message: 'the sorted-out band must be narrower than the tolerance',
    path: ['spread', 'inner'],
  });

const positiveMultiplier = finite().positive().max(100);

/**
 * How the two sections of one envelope vary (percent, 1σ) and how they are paired.
 *
 * @example
 * tubeSpreadSchema.parse({ perveanceSd: 10, muSd: 3, sectionCorrelation: 0.5, pairing: { quantity: 'ia', within: 10 } });
 */
export const tubeSpreadSchema = z.object({
  perveanceSd: finite().min(0).lt(100),
  muSd: finite().min(0).lt(100),
  sectionCorrelation: finite().min(0).max(1),
  pairing: z.object({ quantity: z.enum(['ia', 'gm', 'mu']), within: finite().positive().lt(100) }).optional(),
  /**
   * A measured tube lot: when present each sample draws one whole tube from it (both sections
   * together, so the section-to-section correlation is the lot's own) and perveanceSd, muSd and
   * sectionCorrelation are not used. Each row is [perv1, perv2, mu1, mu2], the multipliers of the
   * model's current scale and mu worked out from the measurements.
   */
  lot: lotRefSchema
    .extend({
      tubes: z
        .array(z.tuple([positiveMultiplier, positiveMultiplier, positiveMultiplier, positiveMultiplier]))
        .min(1),
    })
    .optional(),
});

/**
 * A limit on one metric (in the metric's SI unit); at least one of min and max. The frequency
 * metrics (acGain1, acGain2, acBalanceDb, acPhaseDeg) take the frequency in hertz they apply at.
 *
 * @example
 * specSchema.parse({ metric: 'balanceDb', min: -1, max: 1 });
 * specSchema.parse({ metric: 'acBalanceDb', frequency: 20000, min: -1, max: 1 });
 */
export const specSchema = z
  .object({
    metric: z.enum([...METRIC_IDS, ...CORNER_METRIC_IDS, ...AC_METRIC_IDS]),
    /** Hz; required by the frequency metrics, refused by the others. */
    frequency: finite().positive().max(1e7, 'must be at most 10 MHz').optional(),
    min: finite().optional(),
    max: finite().optional(),
    label: z.string().optional(),
  })
  .refine((s) => (s.frequency !== undefined) === (AC_METRIC_IDS as readonly string[]).includes(s.metric), {
    message: 'frequency (Hz) is required for the frequency metrics and allowed only for them',
    path: ['frequency'],
  })
  .refine((s) => s.min !== undefined || s.max !== undefined, {
    message: 'a spec needs min or max',
    path: ['min'],
  })
  .refine((s) => s.min === undefined || s.max === undefined || s.min <= s.max, {
    message: 'min must not exceed max',
    path: ['max'],
  });

/** The current design document version; older versions are migrated on read (see migrateDesign). */
export const DESIGN_VERSION = 2;

/**
 * The versioned design document (format 'sigmatail-design', version 2): topology, supplies,
 * grid drive (direct-coupled), tube type and spread, toleranced parts and specs. Volts, ohms,
 * farads, hertz, percent. Version 2 added the capacitors (cin, cg2, cout1, cout2, cstray1,
 * cstray2) and frequency specs; an absent coupling or bypass capacitor is ideal (a short for AC),
 * an absent stray capacitance is zero, so a version-1 document keeps its midband results.
 *
 * @example
 * designSchema.safeParse(JSON.parse(text)).success;
 */
export const designSchema = z
  .object({
    format: z.literal('sigmatail-design'),
    version: z.literal(DESIGN_VERSION),
    name: z.string().min(1),
    notes: z.string().optional(),
    /**
     * 'split-load' (format 2, additive): the cathodyne, one section (section 1) with plate load
     * rl1, bias resistor rk from cathode to J, cathode load rt from J to the tail supply, grid
     * leak rg1 to J, outputs at the plate (rload1) and the cathode (rload2); rl2 and rg2 are not
     * used by it (optional for it), nor are cg2 and drive.
     */
    topology: z.enum(['cap-coupled', 'direct-coupled', 'split-load']),
    supply: z.object({
      bPlus: finite().positive(),
      tail: finite().max(0, 'tail supply must be 0 (Rt to ground) or negative'),
      /** Heater potential to ground in volts; 0 (grounded heater winding) when absent. */
      heater: finite().optional(),
    }),
    drive: z
      .object({
        grid1Dc: finite(),
        grid2: z.discriminatedUnion('mode', [
          z.object({ mode: z.literal('fixed'), dc: finite() }),
          z.object({ mode: z.literal('leak-to-grid1') }),
        ]),
      })
      .optional(),
    tube: z.object({ type: z.enum(TUBE_TYPES), spread: tubeSpreadSchema }),
    parts: z.object({
      rl1: partSchema,
      /** Plate load of section 2; required for a long-tailed pair, not used by 'split-load'. */
      rl2: partSchema.optional(),
      rk: partSchema,
      rt: partSchema,
      rg1: partSchema,
      /** Grid leak of section 2; required for a long-tailed pair, not used by 'split-load'. */
      rg2: partSchema.optional(),
      rload1: partSchema.optional(),
      rload2: partSchema.optional(),
      rsource: partSchema.optional(),
      /** Input coupling capacitor, in series with the source into grid 1 (F). */
      cin: capacitorSchema.optional(),
      /** Capacitor that grounds grid 2 for AC (F). */
      cg2: capacitorSchema.optional(),
      /** Output coupling capacitors from each plate into rload1 / rload2 (F). */
      cout1: capacitorSchema.optional(),
      cout2: capacitorSchema.optional(),
      /** Stray plus next-stage input capacitance from each plate to ground (F). */
      cstray1: capacitorSchema.optional(),
      cstray2: capacitorSchema.optional(),
    }),
    specs: z.array(specSchema),
  })
  .refine((d) => d.topology !== 'direct-coupled' || d.drive !== undefined, {
    message: 'a direct-coupled design needs drive (grid1Dc and grid2)',
    path: ['drive'],
  })
  // Section 2's plate load and grid leak belong to the long-tailed pair only (format 2: a
  // split-load document may leave them out; older documents that carry them read as before).
  .refine((d) => d.topology === 'split-load' || d.parts.rl2 !== undefined, {
    message: 'a long-tailed pair needs RL2 (plate load of section 2)',
    path: ['parts', 'rl2'],
  })
  .refine((d) => d.topology === 'split-load' || d.parts.rg2 !== undefined, {
    message: 'a long-tailed pair needs RG2 (grid leak of section 2)',
    path: ['parts', 'rg2'],
  });

/**
 * The design document as written (part values may be text).
 *
 * @example
 * const d: Design = JSON.parse(readFileSync('examples/guitar-12ax7-cap-coupled.json', 'utf8'));
 */
export type Design = z.infer<typeof designSchema>;
/** One toleranced part as written (resistor or capacitor). */
export type Part = z.infer<typeof partSchema> | z.infer<typeof capacitorSchema>;
/** A part value spread. */
export type Spread = z.infer<typeof spreadSchema>;
/** Tube spread and pairing. */
export type TubeSpread = z.infer<typeof tubeSpreadSchema>;
/** A limit on a metric. */
export type Spec = z.infer<typeof specSchema>;
/** Part names in the design's `parts` object. */
export type PartName = keyof Design['parts'];

/** Capacitor part names (farads); the rest are resistors (ohms). */
export const CAPACITOR_PARTS = ['cin', 'cg2', 'cout1', 'cout2', 'cstray1', 'cstray2'] as const;

/** Parts of a long-tailed pair that a split-load stage has no place for (section 2's plate load,
 * grid leak and grid bypass). */
export const SPLIT_LOAD_UNUSED_PARTS = ['rl2', 'rg2', 'cg2'] as const satisfies readonly PartName[];

/** Resistor part names (ohms), in document order. */
export const RESISTOR_PARTS = [
  'rl1',
  'rl2',
  'rk',
  'rt',
  'rg1',
  'rg2',
  'rload1',
  'rload2',
  'rsource',
] as const satisfies readonly Exclude<PartName, (typeof CAPACITOR_PARTS)[number]>[];

/**
 * A part with its value resolved to ohms (resistors) or farads (capacitors); `kind` is a
 * resistor's construction (capacitors have none).
 */
export type ResolvedPart = Omit<Part, 'value'> & { value: number; kind?: ResistorKind };
/**
 * The design with every part value resolved to a number of ohms.
 *
 * @example
 * const r = parseDesign(json);
 * if (r.ok) r.design.parts.rk.value; // 470 (Ω)
 */
export type ResolvedDesign = Omit<Design, 'parts'> & {
  parts: {
    [K in keyof Design['parts']]: Design['parts'][K] extends Part ? ResolvedPart : ResolvedPart | undefined;
  };
};
