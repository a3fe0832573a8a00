import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

// The models run in the browser too, so outside src/cli they import no Node built-ins and use
// no unseeded randomness (eslint enforces the same; this keeps the rule visible in the suite).
const src = fileURLToPath(new URL('../', import.meta.url));
const files = ['values', 'tubes', 'model', 'design']
  .flatMap((dir) => readdirSync(`${src}${dir}`).map((f) => `${dir}/${f}`))
  .concat(['modelsApi.ts'])
  .filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts'));

describe('engine purity (models)', () => {
  it.each(files)('%s imports no Node built-ins and never calls Math.random', (f) => {
    const text = readFileSync(`${src}${f}`, 'utf8');
    expect(text).not.toMatch(/from ['"](node:|fs['"]|path['"]|os['"]|child_process)/);
    expect(text).not.toMatch(/Math\.random/);
    expect(text).not.toMatch(/\bprocess\./);
  });
});
