import { z } from 'zod';
import { designSchema } from './designSchema.js';

/**
 * JSON Schema (draft 2020-12) of the design document, generated from {@link designSchema}. It
 * describes the input form (part values as numbers or text); checks zod expresses as code
 * (parseable RKM text, direct-coupled needs drive) live only in {@link parseDesign}. The committed
 * `packages/engine/design.schema.json` must equal this (a test checks it).
 *
 * @example
 * designJsonSchema().title; // 'Sigmatail design'
 */
export function designJsonSchema(): Record<string, unknown> {
  const { $schema, ...rest } = z.toJSONSchema(designSchema, { io: 'input' }) as Record<string, unknown>;
  return {
    $schema,
    $id: 'https://sigmatail.example/design.schema.json',
    title: 'Sigmatail design',
    description:
      'A phase splitter design (long-tailed pair or split-load): topology, supplies, tube, toleranced parts (ohms or RKM text) and specs.',
    ...rest,
  };
}
