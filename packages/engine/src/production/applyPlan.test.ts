import { describe, expect, it } from 'vitest';
import { buildTestDesign } from '../run/buildTestDesign.js';
import { applyPlan } from './applyPlan.js';

const design = buildTestDesign();
const rule = { quantity: 'gm' as const, within: 7 };

describe('applyPlan', () => {
  it('sets each listed part to its class and leaves the others and the input alone', () => {
    const planned = applyPlan(design, { classes: { rl1: 1, rk: 2 }, tube: 'unmatched' }, rule);
    expect(planned.parts.rl1.tolerance).toBe(1);
    expect(planned.parts.rk.tolerance).toBe(2);
    expect(planned.parts.rl2).toEqual(design.parts.rl2);
    expect(design.parts.rl1.tolerance).toBe(5);
  });

  it('scales a binned part’s sorted-out band with its tolerance, so it stays narrower', () => {
    // Test design: rt is 10 % with the ±5 % parts sorted out.
    const planned = applyPlan(design, { classes: { rt: 2 }, tube: 'unmatched' }, rule);
    expect(planned.parts.rt.spread).toEqual({ kind: 'binned', inner: 1 });
  });

  it('sets the match rule for a matched tube and removes any rule for an unmatched one', () => {
    expect(applyPlan(design, { classes: {}, tube: 'matched' }, rule).tube.spread.pairing).toEqual(rule);
    expect(design.tube.spread.pairing).toBeDefined();
    expect(applyPlan(design, { classes: {}, tube: 'unmatched' }, rule).tube.spread.pairing).toBeUndefined();
  });
});
