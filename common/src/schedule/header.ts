import { DIMENSION_LABEL, findUnit, unitsFor, type Dimension, type UnitDef, type UnitSystemId, defaultUnit } from '../units';
import { columnLetter, resolveCell, type CellValue, type SheetData } from './cells';
import { LOAD_CASES, matchCode, wordKey, type LoadCaseCode } from './codes';
import { columnHeader, headerKeys, LOAD_CASE_COLUMN, LOAD_VALUE_QUANTITIES, type ColumnDef } from './columns';
import type { ProblemList } from './problems';

/** A header cell matched to a column definition, with its unit. */
export interface BoundColumn {
  index: number;
  letter: string;
  header: string;
  def: ColumnDef;
  /** The unit of a quantity, spans or load-case column (from the header or the system default). */
  unit?: UnitDef;
  /** For a Loads value column: the unit of each dimension. */
  valueUnits?: Partial<Record<'force' | 'lineLoad' | 'moment', UnitDef>>;
  loadCase?: LoadCaseCode;
  /** False when the header's unit was unusable; its cells are then not read (one problem, not one per row). */
  usable: boolean;
}

export interface SheetColumns {
  byKey: Map<string, BoundColumn>;
  loadCases: BoundColumn[];
}

/** Name and unit text of a header: "Span [m]", "I (10^6 mm^4)", "Spans". */
export function splitHeader(text: string): { name: string; unitText?: string } {
  const bracket = /^(.*?)\s*\[([^\]]*)\]\s*$/.exec(text);
  if (bracket) return { name: bracket[1].trim(), unitText: bracket[2].trim() };
  const paren = /^(.*?)\s*\(([^)]*)\)\s*$/.exec(text);
  if (paren && paren[1].trim() !== '') {
    const parts = paren[2].split(/[,;|]/).map((p) => p.trim());
    if (parts.every((p) => p !== '' && findUnit(p))) return { name: paren[1].trim(), unitText: paren[2].trim() };
  }
  return { name: text.trim() };
}

function quantityDimension(def: ColumnDef): Dimension {
  if (def.kind === 'spans') return 'length';
  if (def.kind === 'loadCase') return 'lineLoad';
  switch (def.quantity) {
    case 'span':
    case 'position':
    case 'depth':
    case 'camber':
    case 'deflection':
    case 'length':
      return 'length';
    case 'modulus':
    case 'stress':
      return 'stress';
    case 'inertia':
      return 'inertia';
    case 'force':
      return 'force';
    case 'lineLoad':
      return 'lineLoad';
    case 'moment':
      return 'moment';
    default:
      throw new Error(`column ${def.key} has no quantity`);
  }
}

/**
 * Reads the header row: matches each header to a column, resolves units,
 * and reports unknown units, duplicate and missing columns.
 */
export function readHeader(
  sheet: SheetData,
  defs: readonly ColumnDef[],
  opts: { system: UnitSystemId; allowLoadCases: boolean },
  problems: ProblemList,
): SheetColumns {
  const keys = headerKeys(defs);
  const header: CellValue[] = sheet.rows[0] ?? [];
  const byKey = new Map<string, BoundColumn>();
  const loadCases: BoundColumn[] = [];
  const seenCases = new Map<string, BoundColumn>();

  header.forEach((cell, index) => {
    const resolved = resolveCell(cell);
    const letter = columnLetter(index);
    const text = resolved.kind === 'text' ? resolved.text : resolved.kind === 'number' ? String(resolved.value) : '';
    const where = { sheet: sheet.name, row: 1, column: { letter, header: text }, value: cell };
    if (text === '') {
      const hasData = sheet.rows.slice(1).some((row) => resolveCell(row?.[index]).kind !== 'blank');
      if (hasData) {
        problems.warning('UNTITLED_COLUMN', where, `${sheet.name} column ${letter} has values but no header, so it is ignored. Give it a header from the template if it should be read.`);
      }
      return;
    }
    const { name, unitText } = splitHeader(text);
    let def = keys.get(wordKey(name));
    let loadCase: LoadCaseCode | undefined;
    if (!def && opts.allowLoadCases) {
      loadCase = matchCode(LOAD_CASES, name);
      if (loadCase) def = LOAD_CASE_COLUMN;
    }
    if (!def) {
      const unit = unitText ? findUnit(unitText) : undefined;
      if (opts.allowLoadCases && unit?.dimension === 'lineLoad') {
        problems.error(
          'UNKNOWN_LOAD_CASE',
          where,
          `${sheet.name} row 1, column ${letter}: "${text}" looks like a load column, but "${name}" is not a load case Sagline knows. Use one of ${LOAD_CASES.map((c) => c.code).join(', ')} (put superimposed dead load in D), e.g. "D [${unit.symbol}]".`,
        );
      } else {
        problems.warning(
          'UNKNOWN_COLUMN',
          where,
          `${sheet.name} row 1, column ${letter}: "${text}" is not a column Sagline reads, so it is ignored. Known columns: ${defs.map((d) => d.name).join(', ')}${opts.allowLoadCases ? ', and one load column per case (D, L, Lr, S, R, W)' : ''}.`,
        );
      }
      return;
    }

    const bound: BoundColumn = { index, letter, header: text, def, usable: true, ...(loadCase ? { loadCase } : {}) };
    const duplicateOf = loadCase ? seenCases.get(loadCase) : byKey.get(def.key);
    if (duplicateOf) {
      problems.error(
        'DUPLICATE_COLUMN',
        where,
        loadCase
          ? `${sheet.name} row 1: columns ${duplicateOf.letter} ("${duplicateOf.header}") and ${letter} ("${text}") are both load case ${loadCase}. Add them into one column, or move one to the Loads sheet as a udl.`
          : `${sheet.name} row 1: columns ${duplicateOf.letter} ("${duplicateOf.header}") and ${letter} ("${text}") are both the ${def.name} column. Keep one of them.`,
      );
      return;
    }
    bindUnit(bound, unitText, opts.system, where, problems, sheet.name);
    if (loadCase) {
      seenCases.set(loadCase, bound);
      loadCases.push(bound);
    } else {
      byKey.set(def.key, bound);
    }
  });

  for (const def of defs) {
    if (def.required && !byKey.has(def.key)) {
      const aliases = def.aliases.length ? ` (also accepted: ${def.aliases.join(', ')})` : '';
      problems.error(
        'MISSING_COLUMN',
        { sheet: sheet.name, row: 1 },
        `The ${sheet.name} sheet has no ${def.name} column. Add a column headed "${columnHeader(def, opts.system)}"${aliases} to row 1.`,
      );
    }
  }
  return { byKey, loadCases };
}

function bindUnit(
  bound: BoundColumn,
  unitText: string | undefined,
  system: UnitSystemId,
  where: { sheet: string; row: number; column: { letter: string; header: string } },
  problems: ProblemList,
  sheetName: string,
): void {
  const { def } = bound;
  const place = `${sheetName} row 1, column ${bound.letter} ("${bound.header}")`;
  if (def.kind === 'text' || def.kind === 'code' || def.kind === 'category' || def.kind === 'email') {
    if (unitText) problems.warning('UNIT_IGNORED', where, `${place}: ${def.name} has no unit, so "[${unitText}]" is ignored.`);
    return;
  }
  if (def.kind === 'loadValue') {
    const wanted: readonly ('force' | 'lineLoad' | 'moment')[] = def.key === 'endValue' ? ['lineLoad'] : LOAD_VALUE_QUANTITIES;
    const units: Partial<Record<'force' | 'lineLoad' | 'moment', UnitDef>> = {};
    for (const part of (unitText ?? '').split(/[,;|]/).map((p) => p.trim()).filter((p) => p !== '')) {
      const unit = findUnit(part);
      if (!unit) {
        bound.usable = false;
        problems.error('UNKNOWN_UNIT', where, `${place}: "${part}" is not a unit Sagline knows. List one unit per load kind, e.g. "${columnHeader(def, system)}".`);
        return;
      }
      const dim = unit.dimension as 'force' | 'lineLoad' | 'moment';
      if (!wanted.includes(dim) || units[dim]) {
        bound.usable = false;
        problems.error(
          'WRONG_UNIT',
          where,
          units[dim]
            ? `${place}: two ${DIMENSION_LABEL[dim]} units are listed (${units[dim]!.symbol} and ${unit.symbol}). List one unit per load kind, e.g. "${columnHeader(def, system)}".`
            : `${place}: "${part}" is a unit of ${DIMENSION_LABEL[unit.dimension]}; this column takes ${wanted.map((d) => DIMENSION_LABEL[d]).join(', ')} units, e.g. "${columnHeader(def, system)}".`,
        );
        return;
      }
      units[dim] = unit;
    }
    for (const dim of wanted) units[dim] ??= findUnit(defaultUnit(dim, system))!;
    bound.valueUnits = units;
    return;
  }
  const dimension = quantityDimension(def);
  const fallback = def.quantity ?? 'lineLoad';
  if (!unitText) {
    bound.unit = findUnit(defaultUnit(fallback, system))!;
    return;
  }
  const unit = findUnit(unitText);
  const example = def.kind === 'loadCase' ? `"${bound.loadCase} [${defaultUnit('lineLoad', system)}]"` : `"${columnHeader(def, system)}"`;
  if (!unit) {
    bound.usable = false;
    problems.error(
      'UNKNOWN_UNIT',
      where,
      `${place}: "${unitText}" is not a unit Sagline knows. For a ${DIMENSION_LABEL[dimension]} use one of ${unitsFor(dimension).join(', ')}, e.g. ${example}.`,
    );
    return;
  }
  if (unit.dimension !== dimension) {
    bound.usable = false;
    problems.error(
      'WRONG_UNIT',
      where,
      `${place}: "${unitText}" is a unit of ${DIMENSION_LABEL[unit.dimension]}, but ${def.kind === 'loadCase' ? 'a load column' : def.name} holds a ${DIMENSION_LABEL[dimension]}. Use one of ${unitsFor(dimension).join(', ')}, e.g. ${example}.`,
    );
    return;
  }
  bound.unit = unit;
}
