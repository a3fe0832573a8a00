import { describe, expect, it } from 'vitest';
import { parseDesign } from '@sigmatail/engine';
import { defaultDesign } from './defaultDesign.js';
import { withoutUnusedParts } from './withoutUnusedParts.js';

describe('withoutUnusedParts', () => {
  it('drops RL2, RG2 and Cg2 from a split-load document, which still parses', () => {
    const d = { ...defaultDesign(), topology: 'split-load' as const };
    d.parts = { ...d.parts, cg2: { value: '100n', tolerance: 10, spread: { kind: 'normal' } } };
    const saved = withoutUnusedParts(d);
    expect(Object.keys(saved.parts)).not.toContain('rl2');
    expect(Object.keys(saved.parts)).not.toContain('rg2');
    expect(Object.keys(saved.parts)).not.toContain('cg2');
    expect(saved.parts.rl1).toEqual(d.parts.rl1);
    expect(parseDesign(saved).ok).toBe(true);
  });

  it('leaves a long-tailed pair as it is', () => {
    const d = defaultDesign();
    expect(withoutUnusedParts(d)).toBe(d);
  });
});
