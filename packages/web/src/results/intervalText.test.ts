import { describe, expect, it } from 'vitest';
import { intervalText } from './intervalText.js';

describe('intervalText', () => {
  it('says the unit once when both ends share it', () => {
    expect(intervalText([56, 58.3], 'V')).toBe('56 – 58.3 V');
    expect(intervalText([3.18, 3.46], '%')).toBe('3.18 – 3.46 %');
  });
  it('keeps both units when the prefix changes, and a dash for none', () => {
    expect(intervalText([0.98, 1.02], 'V')).toBe('980 mV – 1.02 V');
    expect(intervalText(null, 'V')).toBe('—');
  });
});
