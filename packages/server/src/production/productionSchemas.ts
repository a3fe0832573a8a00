import { MAX_SEED_LENGTH, RESISTOR_KINDS } from '@sigmatail/engine';
import { z } from 'zod';

/** Samples a production study may judge (a plan search judges every candidate on them). */
export const MIN_STUDY_SAMPLES = 1000;
export const MAX_STUDY_SAMPLES = 200_000;

const money = z
  .number({ message: 'must be a price (a number ≥ 0)' })
  .min(0, 'must be a price (a number ≥ 0)')
  .max(1e6, 'must be at most 1000000');
const percent = (what: string) =>
  z
    .number({ message: `must be ${what}` })
    .gt(0, `must be ${what}`)
    .lt(100, `must be ${what}`);
const samples = z
  .int({ message: `must be an integer ${MIN_STUDY_SAMPLES}..${MAX_STUDY_SAMPLES}` })
  .min(MIN_STUDY_SAMPLES, `must be an integer ${MIN_STUDY_SAMPLES}..${MAX_STUDY_SAMPLES}`)
  .max(MAX_STUDY_SAMPLES, `must be an integer ${MIN_STUDY_SAMPLES}..${MAX_STUDY_SAMPLES}`)
  .default(20_000);
const seed = z
  .string()
  .trim()
  .min(1, 'must not be empty')
  .max(MAX_SEED_LENGTH, `must be at most ${MAX_SEED_LENGTH} characters`)
  .optional();
const designRef = {
  designId: z.uuid({ message: 'must be a design id' }),
  revision: z.int().min(1).max(2_147_483_647).optional().describe('design revision (default: the latest)'),
};
const quantity = z.enum(['ia', 'gm', 'mu'], { message: 'must be ia, gm or mu' });

/** PUT /api/prices: the workspace price table. */
export const priceTableBody = z.strictObject({
  currency: z.string().trim().min(1, 'must not be empty').max(8, 'must be at most 8 characters'),
  resistors: z
    .array(
      z.strictObject({
        kind: z.enum(RESISTOR_KINDS, { message: `must be one of ${RESISTOR_KINDS.join(', ')}` }),
        tolerance: z
          .number({ message: 'must be a tolerance in percent (0 < t < 100)' })
          .gt(0, 'must be a tolerance in percent (0 < t < 100)')
          .lt(100, 'must be a tolerance in percent (0 < t < 100)'),
        price: money,
      }),
    )
    .min(1, 'needs at least one resistor price')
    .max(60, 'at most 60 rows'),
  tubes: z.strictObject({ unmatched: money, matched: money }),
});

/** POST /api/plans: search (and save) a tolerance plan. */
export const planBody = z
  .strictObject({
    ...designRef,
    targetPpm: z
      .number({ message: 'must be a reject rate in PPM (0 < ppm < 1000000)' })
      .gt(0, 'must be a reject rate in PPM (0 < ppm < 1000000)')
      .lt(1e6, 'must be a reject rate in PPM (0 < ppm < 1000000)')
      .optional(),
    targetYield: z
      .number({ message: 'must be a yield in percent (0 < y < 100)' })
      .gt(0, 'must be a yield in percent (0 < y < 100)')
      .lt(100, 'must be a yield in percent (0 < y < 100)')
      .optional(),
    confidence: z
      .number({ message: 'must be 0.8..0.999' })
      .min(0.8, 'must be 0.8..0.999')
      .max(0.999, 'must be 0.8..0.999')
      .default(0.95),
    samples,
    seed,
    tubes: z
      .array(z.enum(['unmatched', 'matched'], { message: 'must be unmatched or matched' }))
      .min(1, 'choose at least one tube option')
      .optional(),
    matchWithin: percent('a match window in percent (0 < x < 100)').optional(),
    confirmSamples: z
      .int({ message: 'must be 0 (no confirming run) or an integer 10000..5000000' })
      .refine(
        (n) => n === 0 || (n >= 10_000 && n <= 5_000_000),
        'must be 0 (no confirming run) or an integer 10000..5000000',
      )
      .default(200_000),
  })
  .refine((b) => (b.targetPpm === undefined) !== (b.targetYield === undefined), {
    message: 'give a target: reject rate in PPM or yield in percent (one of them)',
    path: ['targetPpm'],
  });
export type PlanBody = z.infer<typeof planBody>;

/** One envelope rule of a pairing comparison. */
export const envelopeRuleField = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('unmatched') }),
    z.strictObject({
      kind: z.literal('matched'),
      quantity,
      within: percent('a match window in percent (0 < x < 100)'),
    }),
    z.strictObject({
      kind: z.literal('binned'),
      quantity,
      width: percent('a bin width in percent (0 < x < 100)'),
      bins: z
        .int({ message: 'must be an integer 1..21' })
        .min(1, 'must be an integer 1..21')
        .max(21, 'must be an integer 1..21'),
    }),
  ],
  { message: 'kind must be unmatched, matched or binned' },
);

const measured = z.number({ message: 'must be a positive number' }).positive('must be a positive number');

/** POST /api/pairing: compare pairing strategies for one design. */
export const pairingBody = z
  .strictObject({
    ...designRef,
    lot: z
      .strictObject({
        quantity,
        sections: z
          .array(z.tuple([measured, measured], { message: 'must be [section 1, section 2]' }))
          .min(1, 'needs at least one envelope')
          .max(20_000, 'at most 20000 envelopes'),
      })
      .optional()
      .describe('measured envelopes to draw tubes from (default: the design’s spread model)'),
    lotId: z
      .uuid({ message: 'must be a lot id' })
      .optional()
      .describe('a stored tube lot of the workspace to draw tubes from (instead of lot)'),
    strategies: z
      .array(envelopeRuleField)
      .min(1, 'choose at least one strategy')
      .max(6, 'at most 6 strategies'),
    samples,
    seed,
  })
  .refine((b) => !(b.lot && b.lotId), { message: 'give lot or lotId, not both', path: ['lotId'] });

const drift = z.strictObject({
  shift: z
    .number({ message: 'must be a shift in percent (−50..50)' })
    .min(-50, 'must be a shift in percent (−50..50)')
    .max(50, 'must be a shift in percent (−50..50)'),
  sd: z
    .number({ message: 'must be a spread in percent (0..50)' })
    .min(0, 'must be a spread in percent (0..50)')
    .max(50, 'must be a spread in percent (0..50)'),
  source: z
    .string()
    .trim()
    .min(1, 'say where the figure comes from (or "from memory")')
    .max(200, 'must be at most 200 characters'),
});

/** POST /api/ageing: apply an ageing scenario to one design. */
export const ageingBody = z.strictObject({
  ...designRef,
  scenario: z
    .strictObject({
      name: z.string().trim().min(1, 'must not be empty').max(120, 'must be at most 120 characters'),
      resistors: z.strictObject({ 'metal-film': drift, 'carbon-film': drift, 'carbon-comp': drift }),
      emission: drift.extend({
        shift: z
          .number({ message: 'must be a loss in percent (0..90)' })
          .min(0, 'must be a loss in percent (0..90)')
          .max(90, 'must be a loss in percent (0..90)'),
      }),
    })
    .optional()
    .describe('default: the engine’s DEFAULT_AGEING_SCENARIO'),
  samples,
  seed,
});

/** GET /api/plans, /api/pairing/latest, /api/ageing/latest: which design. */
export const designQuery = z.strictObject({ designId: z.uuid({ message: 'must be a design id' }) });
export const optionalDesignQuery = z.strictObject({
  designId: z.uuid({ message: 'must be a design id' }).optional(),
});
