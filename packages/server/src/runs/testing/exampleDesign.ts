import { readFileSync } from 'node:fs';

/** The engine's shipped example design (a cap-coupled 12AX7 stage), as a document. */
export function exampleDesign(): Record<string, unknown> {
  const url = new URL('../../../../engine/examples/guitar-12ax7-cap-coupled.json', import.meta.url);
  return JSON.parse(readFileSync(url, 'utf8')) as Record<string, unknown>;
}
