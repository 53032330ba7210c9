import { defaultUnit, UNIT_SYSTEM_LABEL, unitsFor, type UnitSystemId } from '../units';
import { LOAD_CASES, LOAD_KINDS, MATERIALS, SUPPORT_CODES } from './codes';
import { columnHeader, LOAD_CASE_COLUMN, LOAD_COLUMNS, MEMBER_COLUMNS, type ColumnDef } from './columns';
import { I_OUTLIER_FACTOR, SLENDER_RATIO } from './warnings';

/** Lines for the "How to fill in" sheet of the template, whatever the unit system. */
export const TEMPLATE_HELP: readonly string[] = [
  'How to fill in the member schedule',
  '',
  'Members sheet: one row per member. Row 1 holds the column headers; keep them. Empty rows are skipped.',
  'Mark must be unique in the whole schedule (e.g. L3-B12). Loads rows and flags refer to it.',
  'Units go in square brackets after the header name: "Spans [m]", "I [10^6 mm^4]", "L [kN/m]" or "Spans [ft]", "I [in^4]", "L [plf]". A header without a unit takes the project unit system default.',
  'Headers are matched ignoring case, spaces and punctuation, and other usual names are accepted (Span for Spans, Ix for I, Remarks for Notes). The columns table below lists them.',
  'A cell may also carry its own unit ("24 ft", "7200 mm"); a number alone is in the header unit.',
  'Continuous spans: type the spans joined by "+" as text, e.g. 6.0+4.5+6.0 (in Excel start with an apostrophe so it is not a formula). Interior supports are pins.',
  'Overhangs: Left overhang and Right overhang are the lengths beyond the end supports to free ends. x = 0 is the left end of the member, the tip of the left overhang when there is one.',
  'Supports: pinned (default), fixed-fixed, fixed-pinned, pinned-fixed, cantilever-left (fixed at the left end, free at the right) or cantilever-right (fixed at the right end, free at the left). A cantilever has its length in Spans and no overhangs.',
  'Load columns: one column per load case, headed by its label and a line-load unit: D (dead), L (live), Lr (roof live), S (snow), R (rain), W (wind). Each is a uniform load over the whole member, overhangs included. Leave empty or 0 for none.',
  'Loads sheet (optional): point loads, uniform loads over part of the member, linearly varying loads and moments. Columns Mark, Case, Kind (point, udl, linear, moment), Position (point and moment) or From and To (udl and linear), Value, End value (linear only), Notes.',
  'The Value header lists one unit per load kind: "Value [kN, kN/m, kN·m]" or "Value [kip, plf, kip·ft]".',
  'Signs: forces and line loads are positive downward (gravity), negative upward (uplift). Moments are positive counter-clockwise, with x to the right and y up.',
  'Formulas are fine when the file was last saved by a spreadsheet program, which stores each result; Sagline reads the stored result and says so when there is none.',
  'An upload with any error stores nothing. The report lists each problem with sheet, row, column and how to fix it.',
  `Warnings do not block an upload: a span more than ${SLENDER_RATIO} times the depth, or an I more than ${I_OUTLIER_FACTOR} times above or below the median of members with the same category, material and a similar span (compared as I / depth³ where depths are given) (often a unit slip such as mm^4 against 10^6 mm^4).`,
  'Results assume linear-elastic, small-deflection, prismatic members on idealised supports, with no shear deformation, vibration, ponding or construction sequence. They support checking; they do not replace the judgement of the engineer of record or the adopted building code and its local amendments.',
];

/** A row of the template's column table: header, required, accepted values, help. */
export interface ColumnHelpRow {
  sheet: 'Members' | 'Loads';
  header: string;
  required: boolean;
  accepted: string;
  aliases: string;
  help: string;
}

function accepted(def: ColumnDef, system: UnitSystemId, categories: readonly string[]): string {
  switch (def.kind) {
    case 'category':
      return categories.join(', ');
    case 'code':
      return (def.codes ?? []).map((c) => c.code).join(', ');
    case 'spans':
      return `number(s) joined by "+"; units ${unitsFor('length').join(', ')}`;
    case 'quantity':
      return `number; default unit ${defaultUnit(def.quantity!, system)}`;
    case 'loadCase':
      return `number; units ${unitsFor('lineLoad').join(', ')}`;
    case 'loadValue':
      return def.key === 'endValue' ? `number; line-load unit` : 'number; force (point), line load (udl, linear) or moment unit';
    case 'email':
      return 'e-mail address';
    case 'text':
      return def.maxLength ? `text, up to ${def.maxLength} characters` : 'text';
  }
}

/** The column table for a "How to fill in" sheet or a help page, in template order. */
export function columnHelpRows(system: UnitSystemId, categories: readonly string[]): ColumnHelpRow[] {
  const rows: ColumnHelpRow[] = [];
  for (const def of MEMBER_COLUMNS) {
    rows.push({ sheet: 'Members', header: columnHeader(def, system), required: def.required, accepted: accepted(def, system, categories), aliases: def.aliases.join(', '), help: def.help });
    if (def.key === 'camber') {
      rows.push({
        sheet: 'Members',
        header: LOAD_CASES.map((c) => columnHeader(LOAD_CASE_COLUMN, system, c.code)).join(', '),
        required: false,
        accepted: accepted(LOAD_CASE_COLUMN, system, categories),
        aliases: LOAD_CASES.map((c) => `${c.code}: ${c.aliases.join(', ')}`).join('; '),
        help: LOAD_CASE_COLUMN.help,
      });
    }
  }
  for (const def of LOAD_COLUMNS) {
    rows.push({ sheet: 'Loads', header: columnHeader(def, system), required: def.required, accepted: accepted(def, system, categories), aliases: def.aliases.join(', '), help: def.help });
  }
  return rows;
}

/** The code tables (value, meaning) for a "Codes" sheet and for drop-down lists. */
export function codeTables(
  categories: readonly string[],
  categoryLabels: Readonly<Record<string, string>> = {},
): { title: string; column: string; codes: { code: string; help: string }[] }[] {
  return [
    { title: 'Category', column: 'Category', codes: categories.map((c) => ({ code: c, help: categoryLabels[c] ?? 'limit-set category' })) },
    { title: 'Material', column: 'Material', codes: MATERIALS.map((c) => ({ code: c.code, help: c.help })) },
    { title: 'Supports', column: 'Supports', codes: SUPPORT_CODES.map((c) => ({ code: c.code, help: c.help })) },
    { title: 'Load case', column: 'Case', codes: LOAD_CASES.map((c) => ({ code: c.code, help: c.help })) },
    { title: 'Load kind', column: 'Kind', codes: LOAD_KINDS.map((c) => ({ code: c.code, help: c.help })) },
  ];
}

export function unitSystemNote(system: UnitSystemId): string {
  return `This template uses ${UNIT_SYSTEM_LABEL[system]} units in its headers; any accepted unit may replace them.`;
}
