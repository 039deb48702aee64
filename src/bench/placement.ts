/**
 * Where a new part lands: the free spot nearest the point the user chose, inside the visible drawing, never on
 * another part. Pure geometry so the canvas, the tray and the tests share one answer.
 */
export interface Point {
  x: number;
  y: number;
}
export interface Size {
  width: number;
  height: number;
}
export type Rect = Point & Size;

/** A part not yet measured on the canvas is laid out at about the size a set node has. */
export const DEFAULT_PART_SIZE: Size = { width: 240, height: 180 };

export interface PlacementOptions {
  /** Positions snap to this grid (the canvas's snap grid). */
  grid?: number;
  /** Clear space kept between parts, above and below. */
  gap?: number;
  /**
   * Clear space kept between parts side by side (default `gap`): ports sit on a part's left and right edges with
   * their labels outside it, so beside a part the gap must hold a label.
   */
  gapX?: number;
}

/**
 * True when `a` and `b` come closer than `gapX` side by side or `gap` above and below (exactly that far apart is
 * allowed).
 */
export function overlaps(a: Rect, b: Rect, gap = 0, gapX = gap): boolean {
  return !(
    a.x + a.width + gapX <= b.x ||
    b.x + b.width + gapX <= a.x ||
    a.y + a.height + gap <= b.y ||
    b.y + b.height + gap <= a.y
  );
}

const inside = (r: Rect, bounds: Rect) =>
  r.x >= bounds.x &&
  r.y >= bounds.y &&
  r.x + r.width <= bounds.x + bounds.width &&
  r.y + r.height <= bounds.y + bounds.height;

/**
 * The top-left corner for a part of `size` whose centre the user dropped at `want`.
 * Candidates are the wanted spot and every spot flush against a part's side or the bounds' edge (the nearest free
 * spot of axis-aligned boxes is always one of them), snapped outward to the grid; the nearest free one inside
 * `bounds` wins. When the view is full, the nearest free spot beyond it (the canvas then shows it); never on a part.
 */
export function placePart(
  want: Point,
  size: Size,
  taken: Rect[],
  bounds: Rect,
  { grid = 20, gap = 20, gapX = gap }: PlacementOptions = {},
): Point {
  // `+ 0` turns a negative zero into zero.
  const down = (v: number) => Math.floor(v / grid) * grid + 0;
  const up = (v: number) => Math.ceil(v / grid) * grid + 0;
  const near = (v: number) => Math.round(v / grid) * grid + 0;
  const origin = { x: near(want.x - size.width / 2), y: near(want.y - size.height / 2) };

  const xs = new Set([
    origin.x,
    up(bounds.x),
    down(bounds.x + bounds.width - size.width),
    ...taken.flatMap((t) => [up(t.x + t.width + gapX), down(t.x - gapX - size.width)]),
  ]);
  const ys = new Set([
    origin.y,
    up(bounds.y),
    down(bounds.y + bounds.height - size.height),
    ...taken.flatMap((t) => [up(t.y + t.height + gap), down(t.y - gap - size.height)]),
  ]);
  const free = (r: Rect) => taken.every((t) => !overlaps(r, t, gap, gapX));

  const nearest = (within: Rect | null): Point | null => {
    let best: Point | null = null;
    let bestDistance = Infinity;
    for (const x of xs) {
      for (const y of ys) {
        const r = { x, y, width: size.width, height: size.height };
        if ((within && !inside(r, within)) || !free(r)) continue;
        const d = (x - origin.x) ** 2 + (y - origin.y) ** 2;
        if (d < bestDistance) {
          best = { x, y };
          bestDistance = d;
        }
      }
    }
    return best;
  };
  const found = nearest(bounds) ?? nearest(null);
  if (found) return found;
  const bottom = Math.max(bounds.y, ...taken.map((t) => t.y + t.height));
  return { x: up(bounds.x), y: up(bottom + gap) };
}
