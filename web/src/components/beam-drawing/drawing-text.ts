import type { Combination, Load, Segment, SupportKind } from '@sagline/common/engine';
import { formatQuantity, type UnitSystemId } from '@sagline/common/units';

/**
 * Words of the member drawing. People never see a negative sign: a
 * deflection reads "12.4 mm down" or "3.1 mm up", an upward load "2.00 kN up"
 * (calc-contract.md: deflection positive up, loads positive down).
 */

/** "12.4 mm down" / "3.1 mm up" / "0.0 mm" (rounds to zero) for a signed deflection (m, positive up). */
export function deflectionText(deflection: number, system: UnitSystemId): string {
  const magnitude = formatQuantity(Math.abs(deflection), 'deflection', system);
  // "0.0 mm up" would point a reader at nothing: a value that rounds to zero has no direction.
  if (Number.parseFloat(magnitude) === 0) return magnitude;
  if (deflection < 0) return `${magnitude} down`;
  if (deflection > 0) return `${magnitude} up`;
  return magnitude;
}

/** A length along the member: "7.20 m" / "24.0 ft". */
export function lengthText(metres: number, system: UnitSystemId): string {
  return formatQuantity(Math.abs(metres), 'span', system);
}

function magnitudeWithSense(value: number, quantity: 'force' | 'lineLoad', system: UnitSystemId): string {
  // Loads are positive down (gravity), the usual case; only an upward one says so.
  const text = formatQuantity(Math.abs(value), quantity, system);
  return value < 0 ? `${text} up` : text;
}

/** The value printed beside a load glyph. */
export function loadValueText(load: Load, system: UnitSystemId): string {
  switch (load.kind) {
    case 'point':
      return magnitudeWithSense(load.P, 'force', system);
    case 'udl':
      return magnitudeWithSense(load.w, 'lineLoad', system);
    case 'linear': {
      const sameSense = (load.w1 >= 0) === (load.w2 >= 0) || load.w1 === 0 || load.w2 === 0;
      if (sameSense) {
        const up = load.w1 < 0 || load.w2 < 0;
        const from = formatQuantity(Math.abs(load.w1), 'lineLoad', system, { unitText: 'none' });
        const to = formatQuantity(Math.abs(load.w2), 'lineLoad', system);
        return `${from} → ${to}${up ? ' up' : ''}`;
      }
      return `${magnitudeWithSense(load.w1, 'lineLoad', system)} → ${magnitudeWithSense(load.w2, 'lineLoad', system)}`;
    }
    case 'moment':
      return `${formatQuantity(Math.abs(load.M), 'moment', system)} ${load.M >= 0 ? 'CCW' : 'CW'}`;
  }
}

/** A sentence for one load, for titles and the accessible summary. */
export function loadSentence(load: Load, system: UnitSystemId): string {
  const at = (x: number) => lengthText(x, system);
  switch (load.kind) {
    case 'point':
      return `${load.case}: point load ${loadValueText(load, system)} at ${at(load.x)}`;
    case 'udl':
      return `${load.case}: uniform load ${loadValueText(load, system)} from ${at(load.x1)} to ${at(load.x2)}`;
    case 'linear':
      return `${load.case}: varying load ${loadValueText(load, system)} from ${at(load.x1)} to ${at(load.x2)}`;
    case 'moment':
      return `${load.case}: moment ${formatQuantity(Math.abs(load.M), 'moment', system)} ${
        load.M >= 0 ? 'counter-clockwise' : 'clockwise'
      } at ${at(load.x)}`;
  }
}

export function supportWord(kind: SupportKind): string {
  return kind === 'fixed' ? 'fixed' : 'pin';
}

/**
 * The name of a segment for people. A lone fixed support with its overhang is
 * what the trade calls a cantilever (the contract files it as an overhang).
 */
export function segmentWord(segment: Segment, isCantilever: boolean): string {
  if (segment.kind === 'span') return 'span';
  return isCantilever ? 'cantilever' : 'overhang';
}

/** "1.0 D + 0.5 L" for a combination's factors (cases with factor 0 left out). */
export function combinationFormula(factors: Combination | undefined): string {
  if (!factors) return '';
  const parts = Object.entries(factors)
    .filter(([, f]) => f !== 0 && Number.isFinite(f))
    .map(([c, f]) => `${Number(f.toPrecision(6))} ${c}`);
  return parts.join(' + ').replace(/\+ -/g, '− ');
}
