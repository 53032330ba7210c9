import type { MemberResultView } from '@sagline/common/api-types';
import type { Load, Segment } from '@sagline/common/engine';
import { defaultUnit, formatQuantity, unitInfo, type UnitSystemId } from '@sagline/common/units';

/**
 * Words and numbers of the Member screen. Deflection is positive UP
 * (calc-contract.md): a sagging beam has a negative deflection. The checks
 * and contributions tables print the sign, as a hand calculation does; the
 * drawing says "down" and "up".
 */

/** "span 1", "span 2", "overhang left", "cantilever". */
export function segmentName(segment: Pick<Segment, 'kind' | 'from'>, index: number, all: readonly Pick<Segment, 'kind' | 'from'>[]): string {
  if (segment.kind === 'span') {
    const spanNo = all.slice(0, index + 1).filter((s) => s.kind === 'span').length;
    return `span ${spanNo}`;
  }
  if (!all.some((s) => s.kind === 'span')) return 'cantilever';
  return segment.from === 0 ? 'overhang left' : 'overhang right';
}

/** Decimals for signed deflections in the hand-calculation tables: one more than the display rule's finest. */
export function deflectionDecimals(system: UnitSystemId): number {
  return unitInfo(defaultUnit('deflection', system)).maxDecimals + 1;
}

/** "−12.41 mm", "+0.35 mm", "0.00 mm": signed, with a true minus sign. */
export function signedDeflection(metres: number, system: UnitSystemId): string {
  const decimals = deflectionDecimals(system);
  const text = formatQuantity(Math.abs(metres), 'deflection', system, { decimals });
  if (Number.parseFloat(text) === 0) return text;
  return `${metres < 0 ? '−' : '+'}${text}`;
}

/** "12.4 mm down" / "3.1 mm up" for a signed deflection (m, positive up). */
export function deflectionWords(metres: number, system: UnitSystemId): string {
  const magnitude = formatQuantity(Math.abs(metres), 'deflection', system);
  if (Number.parseFloat(magnitude) === 0) return magnitude;
  return `${magnitude} ${metres < 0 ? 'down' : 'up'}`;
}

/** The span ratio as the trade writes it: "L/412"; "—" for no deflection. */
export function ratioText(ratio: number | null): string {
  if (ratio === null || !Number.isFinite(ratio)) return '—';
  return `L/${ratio >= 100 ? Math.round(ratio).toLocaleString('en-GB') : ratio.toPrecision(3)}`;
}

/** The limit of a check result: "L/360", "L/240 + 6.4 mm", with any cap: "L/360, at most 20.0 mm". */
export function limitText(r: Pick<MemberResultView, 'limitRatio' | 'plus' | 'maxAbs'>, system: UnitSystemId): string {
  let text = `L/${r.limitRatio}`;
  if (r.plus > 0) text += ` + ${formatQuantity(r.plus, 'deflection', system)}`;
  if (r.maxAbs !== null) text += `, at most ${formatQuantity(r.maxAbs, 'deflection', system)}`;
  return text;
}

/** "uniform 6.00 kN/m from 0.00 m to 6.00 m" for one load (SI, positive down). */
export function loadWords(load: Load, system: UnitSystemId): string {
  const at = (x: number) => formatQuantity(x, 'position', system);
  const sense = (v: number, q: 'force' | 'lineLoad') => `${formatQuantity(Math.abs(v), q, system)}${v < 0 ? ' up' : ''}`;
  switch (load.kind) {
    case 'point':
      return `point ${sense(load.P, 'force')} at ${at(load.x)}`;
    case 'udl':
      return `uniform ${sense(load.w, 'lineLoad')} from ${at(load.x1)} to ${at(load.x2)}`;
    case 'linear':
      return `varying ${sense(load.w1, 'lineLoad')} → ${sense(load.w2, 'lineLoad')} from ${at(load.x1)} to ${at(load.x2)}`;
    case 'moment':
      return `moment ${formatQuantity(Math.abs(load.M), 'moment', system)} ${load.M >= 0 ? 'counter-clockwise' : 'clockwise'} at ${at(load.x)}`;
  }
}

/** A combination's factors as a formula: "1.0 D + 1.0 L" (factors of 0 left out). */
export function combinationFormula(factors: Record<string, number> | undefined): string {
  if (!factors) return '';
  return Object.entries(factors)
    .filter(([, f]) => f !== 0 && Number.isFinite(f))
    .map(([c, f]) => `${Number(f.toPrecision(6))} ${c}`)
    .join(' + ')
    .replace(/\+ -/g, '− ');
}

/**
 * Two deflections are "the same number" when they differ by no more than
 * rounding in the last of 12 significant digits (the stored results and a
 * fresh engine run agree to that; both are doubles summed in another order).
 */
export function sameDeflection(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b)) + 1e-15;
}
