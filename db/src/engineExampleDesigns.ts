import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseDesign } from '@sigmatail/engine';

/** packages/engine/examples, seen from db/src or db/dist. */
export const ENGINE_EXAMPLES_DIR = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../../packages/engine/examples',
);

/**
 * The engine's example designs (packages/engine/examples/*.json) that pass parseDesign, so the
 * demo workshop shows them too. Missing folder or an invalid file: skipped, never a failed start.
 */
export function engineExampleDesigns(dir = ENGINE_EXAMPLES_DIR): Record<string, unknown>[] {
  if (!existsSync(dir)) return [];
  const out: Record<string, unknown>[] = [];
  for (const file of readdirSync(dir).sort()) {
    if (!file.endsWith('.json')) continue;
    try {
      const doc = JSON.parse(readFileSync(path.join(dir, file), 'utf8')) as Record<string, unknown>;
      if (parseDesign(doc).ok) out.push(doc);
    } catch {
      // Not JSON: not a design.
    }
  }
  return out;
}
