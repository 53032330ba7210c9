import { defaultUnit, type Quantity, type UnitSystemId } from '../units';
import type { CellPrimitive } from './cells';
import { LOAD_CASES, LOAD_KINDS, MATERIALS, SUPPORT_CODES, wordKey, type CodeDef } from './codes';

/**
 * How a column's cells are read:
 * - text: any text (numbers become text), e.g. Mark, Notes;
 * - code: one of `codes` (Material, Supports, Case, Kind);
 * - category: one of the project's limit-set categories (given to the parser);
 * - spans: one length, or several joined by "+" for continuous spans;
 * - quantity: one number in the header's unit (or a number with its own unit);
 * - email: an e-mail address;
 * - loadCase: a uniform line load over the whole member for one load case;
 * - loadValue: a force, line load or moment, depending on the row's Kind.
 */
export type ColumnKind = 'text' | 'code' | 'category' | 'spans' | 'quantity' | 'email' | 'loadCase' | 'loadValue';

export interface ColumnDef {
  /** Field name in ScheduleMember (Members) or in the load row (Loads). */
  readonly key: string;
  /** The header the template writes (a unit in square brackets follows when the column has one). */
  readonly name: string;
  /** Other headers accepted; matching ignores case, spaces and punctuation. */
  readonly aliases: readonly string[];
  readonly kind: ColumnKind;
  /** Display quantity for unit defaults (span → m / ft, depth → mm / in, …). */
  readonly quantity?: Quantity;
  readonly required: boolean;
  readonly codes?: readonly CodeDef[];
  readonly maxLength?: number;
  /** One or two sentences for the template's "How to fill in" sheet and the web. */
  readonly help: string;
  /** Example cell for the template, per unit system. */
  readonly example: Readonly<Record<UnitSystemId, CellPrimitive>>;
  /** Column width in characters for the template. */
  readonly width: number;
}

export const MARK_MAX = 60;
export const TEXT_MAX = 120;
export const NOTES_MAX = 2000;

/** The Members sheet, one row per member, in template order. Load-case columns go after Camber. */
export const MEMBER_COLUMNS: readonly ColumnDef[] = [
  {
    key: 'mark', name: 'Mark', aliases: ['Member', 'Member mark', 'Beam mark', 'ID', 'Tag'], kind: 'text', required: true, maxLength: MARK_MAX,
    help: 'The member mark, unique in the whole schedule (e.g. L3-B12). Loads rows and flags refer to it.',
    example: { SI: 'L2-B101', US: '2B101' }, width: 12,
  },
  {
    key: 'level', name: 'Level', aliases: ['Floor', 'Storey', 'Story', 'Lvl'], kind: 'text', required: true, maxLength: 40,
    help: 'The level the member belongs to, spelled as in the project (e.g. L2, Roof).',
    example: { SI: 'L2', US: 'L2' }, width: 8,
  },
  {
    key: 'grid', name: 'Grid', aliases: ['Grid line', 'Gridline', 'Grids', 'Location'], kind: 'text', required: false, maxLength: TEXT_MAX,
    help: 'Where the member is, e.g. C/3-4. Optional.',
    example: { SI: 'C/3-4', US: 'C/3-4' }, width: 10,
  },
  {
    key: 'category', name: 'Category', aliases: ['Member category', 'Limit category', 'Check category'], kind: 'category', required: true,
    help: "The member's limit-set category (e.g. floor); it decides which deflection limits apply. Pick it from the drop-down.",
    example: { SI: 'floor', US: 'floor' }, width: 24,
  },
  {
    key: 'material', name: 'Material', aliases: ['Mat', 'Member material'], kind: 'code', codes: MATERIALS, required: true,
    help: 'steel, cold-formed-steel, timber, engineered-wood, concrete, masonry, aluminium or other. Limit sets use it (e.g. L + 0.5D for dry wood).',
    example: { SI: 'steel', US: 'steel' }, width: 16,
  },
  {
    key: 'section', name: 'Section', aliases: ['Size', 'Designation', 'Profile', 'Shape'], kind: 'text', required: false, maxLength: TEXT_MAX,
    help: 'Section or size, for reference only (e.g. W410x54, 2x10 @ 16 in); the calculation uses E and I.',
    example: { SI: 'W410x54', US: 'W16x36' }, width: 14,
  },
  {
    key: 'spans', name: 'Spans', aliases: ['Span', 'Span(s)', 'Span lengths', 'Length'], kind: 'spans', quantity: 'span', required: true,
    help: 'The span between supports. For continuous spans write each span joined by "+", e.g. 6.0+4.5+6.0 (as text). For a cantilever, its length.',
    example: { SI: 7.2, US: 24 }, width: 14,
  },
  {
    key: 'leftOverhang', name: 'Left overhang', aliases: ['Overhang left', 'Left cantilever', 'Left OH', 'OH left'], kind: 'quantity', quantity: 'span', required: false,
    help: 'Length beyond the left support to a free end. Empty or 0 for none.',
    example: { SI: 0, US: 0 }, width: 13,
  },
  {
    key: 'rightOverhang', name: 'Right overhang', aliases: ['Overhang right', 'Right cantilever', 'Right OH', 'OH right'], kind: 'quantity', quantity: 'span', required: false,
    help: 'Length beyond the right support to a free end. Empty or 0 for none.',
    example: { SI: 0, US: 0 }, width: 14,
  },
  {
    key: 'supports', name: 'Supports', aliases: ['Support', 'End conditions', 'End condition', 'Supports / end conditions', 'Fixity', 'Ends'], kind: 'code', codes: SUPPORT_CODES, required: false,
    help: 'End conditions: pinned (default), fixed-fixed, fixed-pinned, pinned-fixed, cantilever-left (fixed at the left end) or cantilever-right (fixed at the right end). Interior supports of continuous spans are pins.',
    example: { SI: 'pinned', US: 'pinned' }, width: 16,
  },
  {
    key: 'E', name: 'E', aliases: ['Modulus', 'E modulus', 'Elastic modulus', "Young's modulus", 'Youngs modulus'], kind: 'quantity', quantity: 'modulus', required: true,
    help: "Young's modulus of elasticity (e.g. 200 GPa / 29,000 ksi for steel).",
    example: { SI: 200, US: 29000 }, width: 10,
  },
  {
    key: 'I', name: 'I', aliases: ['Ix', 'Moment of inertia', 'Inertia', 'Second moment of area'], kind: 'quantity', quantity: 'inertia', required: true,
    help: 'Moment of inertia (second moment of area) about the bending axis, the value to be checked (for concrete an effective I).',
    example: { SI: 186, US: 448 }, width: 14,
  },
  {
    key: 'depth', name: 'Depth', aliases: ['Section depth', 'Member depth', 'h'], kind: 'quantity', quantity: 'depth', required: false,
    help: 'Overall depth of the section. Optional; used only to warn about unusually slender members.',
    example: { SI: 403, US: 15.9 }, width: 11,
  },
  {
    key: 'camber', name: 'Camber', aliases: ['Precamber', 'Camber up'], kind: 'quantity', quantity: 'camber', required: false,
    help: 'Specified upward precamber at midspan, positive. Optional; limit checks may subtract it.',
    example: { SI: null, US: null }, width: 11,
  },
  {
    key: 'reviewer', name: 'Reviewer', aliases: ['Reviewer email', 'Reviewer e-mail', 'Checker', 'Checker email', 'Reviewed by'], kind: 'email', required: false, maxLength: 254,
    help: "E-mail address of the checker assigned to the member. Optional.",
    example: { SI: 'ines.okafor@halvercote.example', US: 'ines.okafor@halvercote.example' }, width: 32,
  },
  {
    key: 'notes', name: 'Notes', aliases: ['Note', 'Remarks', 'Remark', 'Comments', 'Comment'], kind: 'text', required: false, maxLength: NOTES_MAX,
    help: 'Anything a reviewer should know. Optional.',
    example: { SI: null, US: null }, width: 30,
  },
];

/**
 * A uniform load column of the Members sheet: its header is a load case label
 * (D, L, Lr, S, R, W, or the word: Dead, Live, …) followed by a line-load unit,
 * e.g. "D [kN/m]", "L [plf]". The load acts over the whole member, overhangs
 * included, positive downward.
 */
export const LOAD_CASE_COLUMN: ColumnDef = {
  key: 'loadCase', name: '<case>', aliases: [], kind: 'loadCase', quantity: 'lineLoad', required: false,
  help: 'One column per load case, headed by the case label and a line-load unit, e.g. "D [kN/m]", "L [kN/m]". A uniform load over the whole member (overhangs included), positive downward. Empty or 0 for none.',
  example: { SI: 3.5, US: 240 }, width: 10,
};

/** The load cases the template writes a column for. */
export const TEMPLATE_LOAD_CASES = ['D', 'L', 'Lr', 'S', 'W'] as const;

/** The optional Loads sheet: point, partial uniform, linear and moment loads. */
export const LOAD_COLUMNS: readonly ColumnDef[] = [
  {
    key: 'mark', name: 'Mark', aliases: ['Member', 'Member mark'], kind: 'text', required: true, maxLength: MARK_MAX,
    help: 'The mark of a member on the Members sheet.', example: { SI: 'L2-G3', US: '2G3' }, width: 12,
  },
  {
    key: 'case', name: 'Case', aliases: ['Load case', 'LC'], kind: 'code', codes: LOAD_CASES, required: true,
    help: 'Load case label: D, L, Lr, S, R or W.', example: { SI: 'D', US: 'D' }, width: 8,
  },
  {
    key: 'kind', name: 'Kind', aliases: ['Type', 'Load type', 'Load kind'], kind: 'code', codes: LOAD_KINDS, required: true,
    help: 'point, udl (uniform over part of the member), linear (varying from Value to End value) or moment.',
    example: { SI: 'point', US: 'point' }, width: 9,
  },
  {
    key: 'position', name: 'Position', aliases: ['x', 'At', 'Pos', 'Distance'], kind: 'quantity', quantity: 'position', required: false,
    help: 'For point and moment loads: distance from the left end of the member (the left overhang included).',
    example: { SI: 3.6, US: 12 }, width: 12,
  },
  {
    key: 'from', name: 'From', aliases: ['x1', 'Start', 'From x', 'Start x'], kind: 'quantity', quantity: 'position', required: false,
    help: 'For udl and linear loads: where the load starts, from the left end of the member. Empty = the left end.',
    example: { SI: null, US: null }, width: 10,
  },
  {
    key: 'to', name: 'To', aliases: ['x2', 'End', 'To x', 'End x'], kind: 'quantity', quantity: 'position', required: false,
    help: 'For udl and linear loads: where the load ends, from the left end of the member. Empty = the right end.',
    example: { SI: null, US: null }, width: 10,
  },
  {
    key: 'value', name: 'Value', aliases: ['Start value', 'Magnitude', 'Load', 'P', 'w', 'w1', 'M'], kind: 'loadValue', required: true,
    help: 'The force (point), line load (udl; linear at From) or moment (moment). The header lists one unit per kind, e.g. "Value [kN, kN/m, kN·m]". Forces positive downward; moments positive counter-clockwise.',
    example: { SI: 45, US: 10 }, width: 20,
  },
  {
    key: 'endValue', name: 'End value', aliases: ['w2', 'End w', 'Value at end', 'Value end'], kind: 'loadValue', required: false,
    help: 'For linear loads only: the line load at To (in the line-load unit of the header).',
    example: { SI: null, US: null }, width: 18,
  },
  {
    key: 'notes', name: 'Notes', aliases: ['Note', 'Remarks', 'Comment', 'Source'], kind: 'text', required: false, maxLength: NOTES_MAX,
    help: 'Where the load comes from (e.g. "reaction of L2-B104"). Optional.',
    example: { SI: 'reaction of L2-B101', US: 'reaction of 2B101' }, width: 28,
  },
];

/** Dimensions a Loads "Value" header lists units for, in header order. */
export const LOAD_VALUE_QUANTITIES = ['force', 'lineLoad', 'moment'] as const;

/** The header a template writes for a column: "Spans [m]", "I [10^6 mm^4]", "Value [kN, kN/m, kN·m]". */
export function columnHeader(def: ColumnDef, system: UnitSystemId, loadCase?: string): string {
  const name = def.kind === 'loadCase' ? (loadCase ?? 'D') : def.name;
  if (def.kind === 'loadValue') {
    const units = def.key === 'endValue' ? [defaultUnit('lineLoad', system)] : LOAD_VALUE_QUANTITIES.map((q) => defaultUnit(q, system));
    return `${name} [${units.join(', ')}]`;
  }
  return def.quantity ? `${name} [${defaultUnit(def.quantity, system)}]` : name;
}

/** Every header key a set of columns accepts, for the collision check and lookups. */
export function headerKeys(defs: readonly ColumnDef[]): Map<string, ColumnDef> {
  const keys = new Map<string, ColumnDef>();
  for (const def of defs) {
    for (const spelling of [def.name, ...def.aliases]) {
      const key = wordKey(spelling);
      const known = keys.get(key);
      if (known && known !== def) throw new Error(`schedule columns: "${spelling}" names both ${known.key} and ${def.key}`);
      keys.set(key, def);
    }
  }
  return keys;
}
