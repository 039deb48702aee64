import { describe, expect, it } from 'vitest';
import { pairColour, pinOf, pinToPair } from '../../shared/engine/index';

describe('25-pair colour code', () => {
  it('gives the tip and ring colours of the first and last pairs', () => {
    expect(pairColour(1)).toEqual({ tip: 'white', ring: 'blue', name: 'white-blue' }); // ICEA S-80-576
    expect(pairColour(25)).toEqual({ tip: 'violet', ring: 'slate', name: 'violet-slate' }); // ICEA S-80-576
  });

  it('follows tip colour floor((n-1)/5) and ring colour (n-1) mod 5', () => {
    expect(pairColour(9).name).toBe('red-brown'); // ICEA S-80-576
    expect(pairColour(17).name).toBe('yellow-orange'); // ICEA S-80-576
    expect(pairColour(18).name).toBe('yellow-green'); // ICEA S-80-576
    expect(pairColour(23).name).toBe('violet-green'); // ICEA S-80-576
    expect(pairColour(24).name).toBe('violet-brown'); // ICEA S-80-576
    expect(pairColour(5).name).toBe('white-slate'); // ICEA S-80-576
    expect(pairColour(6).name).toBe('red-blue'); // ICEA S-80-576
  });

  it('refuses pairs a 25-pair cable does not have', () => {
    expect(() => pairColour(0)).toThrow(RangeError);
    expect(() => pairColour(26)).toThrow(/does not exist/);
  });
});

describe('50-pin connector', () => {
  it('puts the ring of pair n on pin n and the tip on pin n+25', () => {
    expect(pinOf(1, 'ring')).toBe(1); // USOC RJ21X, 47 CFR Part 68 Subpart F
    expect(pinOf(1, 'tip')).toBe(26); // USOC RJ21X, 47 CFR Part 68 Subpart F
    expect(pinOf(17, 'tip')).toBe(42); // USOC RJ21X, 47 CFR Part 68 Subpart F
    expect(pinOf(25, 'ring')).toBe(25); // USOC RJ21X, 47 CFR Part 68 Subpart F
    expect(pinOf(25, 'tip')).toBe(50); // USOC RJ21X, 47 CFR Part 68 Subpart F
  });

  it('maps every pin back to its pair and conductor', () => {
    for (let pin = 1; pin <= 50; pin++) {
      const { pair, conductor } = pinToPair(pin);
      expect(pinOf(pair, conductor)).toBe(pin);
    }
    expect(() => pinToPair(51)).toThrow(RangeError);
  });
});
