import { DESIGN_VERSION } from './designSchema.js';

/**
 * Brings an older design document up to the current version ({@link DESIGN_VERSION}); anything
 * else (current version, other formats, non-objects) is returned as is for the schema to judge.
 * Version 1 → 2: version 2 only added optional parts (capacitors) and frequency specs; their
 * absence means ideal coupling and no stray capacitance, so a version-1 document keeps every
 * midband result it had.
 *
 * @example
 * migrateDesign({ format: 'sigmatail-design', version: 1, ... }).version; // 2
 */
export function migrateDesign(input: unknown): unknown {
  if (typeof input !== 'object' || input === null || Array.isArray(input)) return input;
  const doc = input as Record<string, unknown>;
  if (doc.format !== 'sigmatail-design' || doc.version !== 1) return input;
  return { ...doc, version: DESIGN_VERSION };
}
