import {
  LARGE_SIGNAL_SUBSAMPLE,
  MAX_LARGE_SIGNAL_SAMPLES,
  MIN_LARGE_SIGNAL_SAMPLES,
  MAX_SAMPLES,
  MAX_SEED_LENGTH,
  MIN_SAMPLES,
  SAMPLING_PLANS,
} from '@sigmatail/engine';
import { z } from 'zod';

/** The run statuses, in lifecycle order. */
export const RUN_STATUSES = ['queued', 'running', 'merging', 'done', 'failed', 'cancelled'] as const;

const LS_SAMPLES = `must be an integer ${MIN_LARGE_SIGNAL_SAMPLES}..${MAX_LARGE_SIGNAL_SAMPLES}`;

/** POST /api/runs: launch a run of one design revision. */
export const launchRunBody = z.strictObject({
  designId: z.uuid({ message: 'must be a design id' }),
  revision: z.int().min(1).max(2_147_483_647).optional().describe('design revision (default: the latest)'),
  samples: z
    .int({ message: `must be an integer ${MIN_SAMPLES}..${MAX_SAMPLES}` })
    .min(MIN_SAMPLES, `must be an integer ${MIN_SAMPLES}..${MAX_SAMPLES}`)
    .max(MAX_SAMPLES, `must be an integer ${MIN_SAMPLES}..${MAX_SAMPLES}`),
  seed: z
    .string()
    .trim()
    .min(1, 'must not be empty')
    .max(MAX_SEED_LENGTH, `must be at most ${MAX_SEED_LENGTH} characters`)
    .optional()
    .describe('random when omitted; stored with the run'),
  plan: z.enum(SAMPLING_PLANS, { message: `must be one of ${SAMPLING_PLANS.join(', ')}` }),
  analyses: z
    .strictObject({
      influence: z.boolean().optional(),
      varianceIndices: z.boolean().optional(),
      worstCase: z.boolean().optional(),
      largeSignal: z
        .boolean()
        .optional()
        .describe(
          `large-signal figures per sample on the run's first ${LARGE_SIGNAL_SUBSAMPLE} samples (off by default)`,
        ),
      largeSignalSamples: z
        .int({ message: LS_SAMPLES })
        .min(MIN_LARGE_SIGNAL_SAMPLES, LS_SAMPLES)
        .max(MAX_LARGE_SIGNAL_SAMPLES, LS_SAMPLES)
        .optional()
        .describe(
          `size of the large-signal subsample (default ${LARGE_SIGNAL_SUBSAMPLE}); used with largeSignal`,
        ),
    })
    .optional()
    .describe('once-per-run analyses to include (influence, variance indices, worst case on by default)'),
});
export type LaunchRunBody = z.infer<typeof launchRunBody>;

/** GET /api/runs query. */
export const listRunsQuery = z.strictObject({
  designId: z.uuid({ message: 'must be a design id' }).optional(),
  status: z.enum(RUN_STATUSES, { message: `must be one of ${RUN_STATUSES.join(', ')}` }).optional(),
  limit: z.coerce
    .number({ message: 'must be an integer 1..200' })
    .int('must be an integer 1..200')
    .min(1, 'must be an integer 1..200')
    .max(200, 'must be an integer 1..200')
    .default(50),
});
export type ListRunsQuery = z.infer<typeof listRunsQuery>;

/** A run as the API presents it. */
export const runView = z.object({
  id: z.uuid(),
  designId: z.uuid(),
  designName: z.string(),
  revision: z.int(),
  status: z.enum(RUN_STATUSES),
  samples: z.int(),
  seed: z.string(),
  plan: z.enum(SAMPLING_PLANS),
  chunkSize: z.int(),
  analyses: z
    .record(z.string(), z.union([z.boolean(), z.int()]))
    .describe('as launched: switches, and largeSignalSamples when set'),
  engineVersion: z.string(),
  progress: z.object({
    done: z.int().describe('finished queue tasks (sample chunks and the once-per-run task)'),
    total: z.int(),
    fraction: z.number().min(0).max(1),
  }),
  error: z.string().nullable(),
  createdBy: z.object({ id: z.uuid(), name: z.string() }),
  createdAt: z.iso.datetime(),
  startedAt: z.iso.datetime().nullable(),
  finishedAt: z.iso.datetime().nullable(),
  summary: z
    .object({ validCount: z.number().nullable(), jointYield: z.number().nullable() })
    .nullable()
    .describe('from the stored results, once done'),
});
export type RunView = z.infer<typeof runView>;

/** Most rows GET /api/runs/:id/samples returns (a scatter preview, not an export). */
export const MAX_SAMPLE_PREVIEW = 10_000;

/** GET /api/runs/:id/samples query. */
export const samplesQuery = z.strictObject({
  limit: z.coerce
    .number({ message: `must be an integer 1..${MAX_SAMPLE_PREVIEW}` })
    .int(`must be an integer 1..${MAX_SAMPLE_PREVIEW}`)
    .min(1, `must be an integer 1..${MAX_SAMPLE_PREVIEW}`)
    .max(MAX_SAMPLE_PREVIEW, `must be an integer 1..${MAX_SAMPLE_PREVIEW}`)
    .default(2_000),
});
