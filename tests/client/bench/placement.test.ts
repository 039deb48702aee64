import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { overlaps, placePart, type Rect } from '@/bench/placement';

// Sizes and gaps are the canvas's own choices (common practice, no published source).
const SIZE = { width: 200, height: 120 };
const VIEW: Rect = { x: 0, y: 0, width: 1200, height: 800 };
const GAP = 20;

describe('placePart', () => {
  it('keeps the wanted spot (centred on the drop point, on the grid) when nothing is there', () => {
    expect(placePart({ x: 400, y: 300 }, SIZE, [], VIEW)).toEqual({ x: 300, y: 240 });
  });

  it('moves a part dropped on another to the nearest side with a clear gap', () => {
    const part: Rect = { x: 300, y: 240, width: 200, height: 120 };
    const at = placePart({ x: 400, y: 300 }, SIZE, [part], VIEW, { gap: GAP });
    expect(overlaps({ ...at, ...SIZE }, part, GAP)).toBe(false);
    // The nearest free spot is directly above or below: 120 + 20 away, less than the 200 + 20 to either side.
    expect(Math.abs(at.x - 300) + Math.abs(at.y - 240)).toBe(140);
  });

  it('pulls a drop beyond the edge of the view back inside it', () => {
    const at = placePart({ x: 1300, y: -100 }, SIZE, [], VIEW);
    expect(at.x + SIZE.width).toBeLessThanOrEqual(VIEW.width);
    expect(at.y).toBeGreaterThanOrEqual(0);
  });

  it('goes to the nearest free spot beyond the view when the view has no room left', () => {
    const full: Rect = { x: -10, y: -10, width: 1220, height: 820 };
    const at = placePart({ x: 600, y: 500 }, SIZE, [full], VIEW, { gap: GAP });
    expect(overlaps({ ...at, ...SIZE }, full, GAP)).toBe(false);
    // Nearest is below the full box: its bottom 810 plus the 20 gap, up to the grid, is 840 (400 from the
    // wanted top 440); above it would be -160 (600 away).
    expect(at).toEqual({ x: 500, y: 840 });
  });

  const rect = fc.record({
    x: fc.integer({ min: -400, max: 1400 }),
    y: fc.integer({ min: -400, max: 1000 }),
    width: fc.integer({ min: 40, max: 400 }),
    height: fc.integer({ min: 40, max: 300 }),
  });

  it('never places a part on an existing one, keeps the side gap beside parts, and always lands on the grid', () => {
    fc.assert(
      fc.property(
        fc.array(rect, { maxLength: 25 }),
        fc.record({ x: fc.integer({ min: -500, max: 1700 }), y: fc.integer({ min: -500, max: 1300 }) }),
        rect,
        fc.constantFrom(GAP, 120),
        (taken, want, size, gapX) => {
          const at = placePart(want, size, taken, VIEW, { gap: GAP, gapX });
          const placed = { ...at, width: size.width, height: size.height };
          for (const t of taken) expect(overlaps(placed, t, GAP, gapX)).toBe(false);
          expect(Number.isInteger(at.x / 20)).toBe(true);
          expect(Number.isInteger(at.y / 20)).toBe(true);
        },
      ),
      { numRuns: 600 },
    );
  });

  it('counts the side gap side by side and the plain gap above and below', () => {
    const part: Rect = { x: 0, y: 0, width: 200, height: 120 };
    expect(overlaps(part, { ...part, x: 320 }, GAP, 120)).toBe(false);
    expect(overlaps(part, { ...part, x: 300 }, GAP, 120)).toBe(true);
    expect(overlaps(part, { ...part, y: 140 }, GAP, 120)).toBe(false);
  });

  it('stays inside the view whenever a free column is left at its left edge', () => {
    fc.assert(
      fc.property(
        fc.array(
          rect.map((r) => ({ ...r, x: Math.max(r.x, 300) })),
          { maxLength: 20 },
        ),
        fc.record({ x: fc.integer({ min: -500, max: 1700 }), y: fc.integer({ min: -500, max: 1300 }) }),
        (taken, want) => {
          const at = placePart(want, SIZE, taken, VIEW, { gap: GAP });
          expect(at.x).toBeGreaterThanOrEqual(VIEW.x);
          expect(at.y).toBeGreaterThanOrEqual(VIEW.y);
          expect(at.x + SIZE.width).toBeLessThanOrEqual(VIEW.x + VIEW.width);
          expect(at.y + SIZE.height).toBeLessThanOrEqual(VIEW.y + VIEW.height);
          for (const t of taken) expect(overlaps({ ...at, ...SIZE }, t, GAP)).toBe(false);
        },
      ),
      { numRuns: 300 },
    );
  });
});
