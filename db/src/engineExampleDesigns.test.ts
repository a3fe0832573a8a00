import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO_DESIGNS } from './demoDesigns.js';
import { engineExampleDesigns } from './engineExampleDesigns.js';

describe('engineExampleDesigns', () => {
  it('keeps valid designs and skips invalid or non-JSON files', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'sigmatail-examples-'));
    writeFileSync(path.join(dir, 'a.json'), JSON.stringify(DEMO_DESIGNS[0]));
    writeFileSync(path.join(dir, 'b.json'), JSON.stringify({ format: 'sigmatail-design', version: 1 }));
    writeFileSync(path.join(dir, 'c.json'), '{ not json');
    writeFileSync(path.join(dir, 'notes.txt'), 'hello');
    expect(engineExampleDesigns(dir).map((d) => d.name)).toEqual([DEMO_DESIGNS[0]!.name]);
  });

  it('returns nothing for a missing folder', () => {
    expect(engineExampleDesigns('/nonexistent/sigmatail/examples')).toEqual([]);
  });
});
