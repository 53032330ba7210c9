import type { Dimension } from './dimensions';
import type { UnitSystemId } from './unit-table';

/**
 * What a number means on a screen or in a schedule column. Several share a
 * dimension but not a display unit: a span is shown in m, its deflection in mm.
 */
export const QUANTITIES = {
  length: 'length',
  span: 'length',
  position: 'length',
  deflection: 'length',
  depth: 'length',
  camber: 'length',
  force: 'force',
  lineLoad: 'lineLoad',
  moment: 'moment',
  stress: 'stress',
  modulus: 'stress',
  inertia: 'inertia',
} as const satisfies Record<string, Dimension>;
export type Quantity = keyof typeof QUANTITIES;

/**
 * The default display (and schedule header) unit of each quantity in each
 * unit system. A schedule header without a unit takes these.
 */
export const UNIT_SYSTEMS: Readonly<Record<UnitSystemId, Readonly<Record<Quantity, string>>>> = {
  SI: {
    length: 'm',
    span: 'm',
    position: 'm',
    deflection: 'mm',
    depth: 'mm',
    camber: 'mm',
    force: 'kN',
    lineLoad: 'kN/m',
    moment: 'kN·m',
    stress: 'MPa',
    modulus: 'GPa',
    inertia: '10^6 mm^4',
  },
  US: {
    length: 'ft',
    span: 'ft',
    position: 'ft',
    deflection: 'in',
    depth: 'in',
    camber: 'in',
    force: 'kip',
    lineLoad: 'plf',
    moment: 'kip·ft',
    stress: 'ksi',
    modulus: 'ksi',
    inertia: 'in^4',
  },
};

export const UNIT_SYSTEM_LABEL: Readonly<Record<UnitSystemId, string>> = {
  SI: 'SI (metric)',
  US: 'US customary',
};

export function isQuantity(value: string): value is Quantity {
  return Object.prototype.hasOwnProperty.call(QUANTITIES, value);
}

/** The default unit for a quantity (or a dimension, which is also a quantity) in a system. */
export function defaultUnit(quantity: Quantity, system: UnitSystemId): string {
  return UNIT_SYSTEMS[system][quantity];
}
