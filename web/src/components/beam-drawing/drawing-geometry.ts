/**
 * Pure scale and placement arithmetic of the member drawing, kept apart from
 * React so that it can be tested on its own.
 *
 * Two scales, both stated in the drawing:
 * - horizontal: one px-per-metre for the whole member, so spans, overhangs,
 *   supports and loads are all to scale;
 * - vertical, for the elastic curve only: the same px-per-metre times an
 *   exaggeration factor ("deflection × 120"), one factor per drawing so that
 *   two combinations can be compared by eye.
 * Screen y grows downward; deflection is positive UP (calc-contract.md), so
 * every deflection is negated on the way to the screen.
 */

/** Where the member sits across the drawing, px. */
export interface DrawingFrame {
  /** Total drawing width, px. */
  width: number;
  /** Room left of x = 0: case labels and a fixed wall at the left end. */
  marginLeft: number;
  /** Room right of x = length: a fixed wall at the right end, label overhang. */
  marginRight: number;
}

export const DEFAULT_WIDTH = 760;
export const DEFAULT_HEIGHT = 420;

/** The horizontal frame for a drawing `width` px wide. */
export function drawingFrame(width: number = DEFAULT_WIDTH): DrawingFrame {
  const w = Number.isFinite(width) && width > 0 ? width : DEFAULT_WIDTH;
  return { width: w, marginLeft: 58, marginRight: 30 };
}

/** Width available to the member itself, px. */
export function drawableWidth(frame: DrawingFrame): number {
  return Math.max(1, frame.width - frame.marginLeft - frame.marginRight);
}

/** px per metre along the member: the drawable width over the member length. */
export function pxPerMetre(length: number, frame: DrawingFrame): number {
  return length > 0 && Number.isFinite(length) ? drawableWidth(frame) / length : 0;
}

/** The screen x (px) of a position x (m from the left end). */
export function xToPx(x: number, length: number, frame: DrawingFrame): number {
  return frame.marginLeft + x * pxPerMetre(length, frame);
}

/**
 * Mantissas of the "nice" factors. Consecutive steps differ by at most 4/3,
 * so the largest nice factor under a 20 % target always lands at 15 % or more.
 */
const NICE_MANTISSAS = [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8] as const;

/** The largest nice number (1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8 × 10ⁿ) not above `value`. */
export function niceFloor(value: number): number {
  if (!(value > 0) || !Number.isFinite(value)) return 0;
  const exponent = Math.floor(Math.log10(value));
  // Round the decade to 12 significant digits so that 120 stays 120, not 100.
  for (let e = exponent + 1; e >= exponent - 1; e--) {
    const decade = 10 ** e;
    for (let i = NICE_MANTISSAS.length - 1; i >= 0; i--) {
      const candidate = Number((NICE_MANTISSAS[i] * decade).toPrecision(12));
      if (candidate <= value * (1 + 1e-12)) return candidate;
    }
  }
  return 0;
}

/** Share of the drawing height the largest drawn deflection aims at (upper bound). */
export const CURVE_HEIGHT_SHARE = 0.2;

/**
 * The exaggeration factor of the elastic curve: the largest nice number that
 * draws the largest deflection magnitude (m) at no more than `share` of the
 * drawing height, hence at 15–20 % of it. null when nothing deflects (the
 * curve is drawn flat and no factor is stated).
 */
export function exaggerationFactor(
  maxAbsDeflection: number,
  pxPerM: number,
  drawingHeight: number,
  share: number = CURVE_HEIGHT_SHARE,
): number | null {
  if (!(maxAbsDeflection > 0) || !(pxPerM > 0) || !(drawingHeight > 0)) return null;
  if (!Number.isFinite(maxAbsDeflection) || !Number.isFinite(pxPerM)) return null;
  const exact = (share * drawingHeight) / (maxAbsDeflection * pxPerM);
  const nice = niceFloor(exact);
  return nice > 0 ? nice : null;
}

/**
 * Screen offset (px, positive DOWN) of a deflection (m, positive UP) from the
 * undeformed axis: negated, since screen y grows downward.
 */
export function deflectionToPx(deflection: number, pxPerM: number, factor: number | null): number {
  if (factor === null || !Number.isFinite(deflection)) return 0;
  const dy = -deflection * pxPerM * factor;
  return dy === 0 ? 0 : dy; // no "-0" in attributes
}

/** "120", "2.5", "0.5", "12,000": the factor as stated in the drawing. */
export function formatFactor(factor: number): string {
  const rounded = Number(factor.toPrecision(6));
  return rounded.toLocaleString('en-US', { maximumFractionDigits: 6, useGrouping: rounded >= 10000 });
}

/**
 * A rough width of a label in px (IBM Plex Sans, the app font): narrow
 * characters count less. Used only to keep labels apart, so it errs wide.
 */
export function estimateTextWidth(text: string, fontSize: number): number {
  let units = 0;
  for (const ch of text) {
    if (ch === ' ' || ch === '.' || ch === ',' || ch === ':' || ch === '·' || ch === 'i' || ch === 'l') units += 0.34;
    else if (ch === 'm' || ch === 'M' || ch === 'W' || ch === 'w') units += 0.9;
    else if (ch >= 'A' && ch <= 'Z') units += 0.7;
    else units += 0.6;
  }
  return units * fontSize;
}

/** A horizontal extent, px. */
export interface Extent {
  left: number;
  right: number;
}

/**
 * Greedy row assignment: each extent (in the given order) takes the lowest
 * row where it keeps `gap` px from every extent already there. Returns the
 * row of each extent (0 = nearest the drawing element it labels).
 */
export function assignRows(extents: readonly Extent[], gap = 6): number[] {
  const rows: Extent[][] = [];
  return extents.map((e) => {
    let row = 0;
    for (; row < rows.length; row++) {
      if (rows[row].every((o) => e.right + gap <= o.left || e.left >= o.right + gap)) break;
    }
    (rows[row] ??= []).push(e);
    return row;
  });
}

/** A label's horizontal placement: its extent and how the SVG text is anchored. */
export interface LabelBox extends Extent {
  /** The text's x, px, for `anchor`. */
  x: number;
  anchor: 'start' | 'middle' | 'end';
}

/**
 * A label of about `textWidth` px centred at `centre`, slid (not squeezed) to
 * stay within [min, max]. A slid label is anchored at the bound it touches,
 * so a wider font than estimated still never runs off the drawing.
 */
export function placeLabel(centre: number, textWidth: number, min: number, max: number): LabelBox {
  if (centre + textWidth / 2 > max) return { left: max - textWidth, right: max, x: max, anchor: 'end' };
  if (centre - textWidth / 2 < min) return { left: min, right: min + textWidth, x: min, anchor: 'start' };
  return { left: centre - textWidth / 2, right: centre + textWidth / 2, x: centre, anchor: 'middle' };
}

/** A 2-decimal number for SVG attributes (shorter markup; never "-0"). */
export function px(value: number): string {
  const r = Math.round(value * 100) / 100;
  return String(r === 0 ? 0 : r);
}

/** An SVG path through screen points ("M x y L x y …"). */
export function pathThrough(points: ReadonlyArray<readonly [number, number]>): string {
  return points.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${px(x)} ${px(y)}`).join(' ');
}
