import { describe, expect, it } from 'vitest';
import { countWords } from '../../shared/engine/document/words';

// Expected figures are plain arithmetic (the value printed to two significant figures with its power of ten).
describe('countWords', () => {
  it('groups the digits of a count up to a billion', () => {
    expect(countWords(0)).toBe('0');
    expect(countWords(4_000_000)).toBe('4,000,000');
    expect(countWords(999_999_999)).toBe('999,999,999');
  });

  it('says a larger count as its leading figures and a power of ten', () => {
    expect(countWords(1e9)).toBe('about 1.0 × 10⁹');
    expect(countWords(687_970_713_600)).toBe('about 6.9 × 10¹¹');
    expect(countWords(2.489071056189074e48)).toBe('about 2.5 × 10⁴⁸');
    expect(countWords(Infinity)).toBe('more than can be counted');
  });
});
