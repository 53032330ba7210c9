/**
 * Field constraints shared by api DTO decorators and web form rules, so both
 * sides enforce the same numbers.
 */
export const LIMITS = {
  nameMax: 120,
  emailMax: 254,
  passwordMin: 10,
  passwordMax: 200,
  projectNameMax: 160,
  projectNumberMax: 40,
  levelNameMax: 40,
  levelsMax: 200,
  /** Invitation links expire after this many hours. */
  invitationHours: 72,
} as const;

/** Per-project roles (product.md). Admin is account-wide, not a project role. */
export const PROJECT_ROLES = ['manager', 'engineer', 'checker', 'viewer'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const UNIT_SYSTEMS = ['SI', 'US'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];
