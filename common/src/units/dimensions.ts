/**
 * The physical dimensions a member schedule uses. The engine works in the SI
 * base unit of each (calc-contract.md, "Units and signs").
 */
export const DIMENSIONS = ['length', 'force', 'lineLoad', 'moment', 'stress', 'inertia'] as const;
export type Dimension = (typeof DIMENSIONS)[number];

/** The SI base unit the engine uses for each dimension. */
export const SI_BASE_UNIT: Readonly<Record<Dimension, string>> = {
  length: 'm',
  force: 'N',
  lineLoad: 'N/m',
  moment: 'N·m',
  stress: 'Pa',
  inertia: 'm^4',
};

/** Words for messages: "a length", "a line load (force per length)". */
export const DIMENSION_LABEL: Readonly<Record<Dimension, string>> = {
  length: 'length',
  force: 'force',
  lineLoad: 'line load (force per length)',
  moment: 'moment',
  stress: 'stress or modulus',
  inertia: 'moment of inertia (length to the fourth power)',
};

export function isDimension(value: unknown): value is Dimension {
  return typeof value === 'string' && (DIMENSIONS as readonly string[]).includes(value);
}
