import { describe, expect, it } from 'vitest';
import { MAX_PICKED_RUNS, togglePick } from './togglePick.js';

// Picking rules of the run tables (common practice, no source).
describe('togglePick', () => {
  it('adds a ticked run and removes an unticked one', () => {
    expect(togglePick(['a'], 'b', true)).toEqual(['a', 'b']);
    expect(togglePick(['a', 'b'], 'a', false)).toEqual(['b']);
  });

  it('drops the oldest pick once more than the limit are ticked', () => {
    const full = ['a', 'b', 'c', 'd'].slice(0, MAX_PICKED_RUNS);
    expect(togglePick(full, 'e', true)).toEqual([...full.slice(1), 'e']);
  });
});
