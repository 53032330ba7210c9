import { formatInUnit, fromSIDecimal, parseQuantity, toSI, UnitError, type Dimension, type UnitDef } from '../units';
import { resolveCell, type CellValue, type ResolvedCell } from './cells';
import { matchCode, type CodeDef } from './codes';
import type { BoundColumn } from './header';
import { placeLabel, type ProblemList, type Where } from './problems';

/** Marks a cell that could not be read; its problem is already reported. */
export const FAIL = Symbol('unreadable cell');
export type Read<T> = T | null | typeof FAIL;

/** Reads cells of one row and reports what is wrong with them. */
export class RowReader {
  failed = false;

  constructor(
    private readonly sheet: string,
    readonly row: number,
    private readonly cells: readonly CellValue[],
    private readonly problems: ProblemList,
    public mark?: string,
  ) {}

  where(col: BoundColumn | undefined): Where {
    return {
      sheet: this.sheet,
      row: this.row,
      column: col ? { letter: col.letter, header: col.header } : null,
      ...(this.mark !== undefined ? { mark: this.mark } : {}),
      value: col ? this.cells[col.index] : undefined,
    };
  }

  raw(col: BoundColumn | undefined): CellValue {
    return col ? this.cells[col.index] : undefined;
  }

  fail(code: Parameters<ProblemList['error']>[0], col: BoundColumn | undefined, message: string): typeof FAIL {
    this.failed = true;
    this.problems.error(code, this.where(col), `${placeLabel(this.where(col))}: ${message}`);
    return FAIL;
  }

  warn(code: Parameters<ProblemList['warning']>[0], col: BoundColumn | undefined, message: string): void {
    this.problems.warning(code, this.where(col), `${placeLabel(this.where(col))}: ${message}`);
  }

  /** The resolved cell, or FAIL after reporting a formula without a result or an error value. */
  private resolve(col: BoundColumn): ResolvedCell | typeof FAIL {
    const cell = resolveCell(this.cells[col.index]);
    if (cell.kind === 'no-result') {
      return this.fail(
        'FORMULA_NO_RESULT',
        col,
        `the formula =${cell.formula.replace(/^=/, '')} has no saved result (the file was written by a program that does not calculate). Open the file in a spreadsheet program and save it, or type the value instead of the formula.`,
      );
    }
    if (cell.kind === 'error') {
      return this.fail('CELL_ERROR', col, `the cell shows the error ${cell.error}. Fix the formula or type the value.`);
    }
    return cell;
  }

  /** Text of a text-like cell (numbers become text); null when blank. */
  text(col: BoundColumn | undefined, maxLength?: number): Read<string> {
    if (!col) return null;
    if (!col.usable) return this.silentFail();
    const cell = this.resolve(col);
    if (cell === FAIL) return FAIL;
    let text: string | null;
    switch (cell.kind) {
      case 'blank':
        return null;
      case 'text':
        text = cell.text;
        break;
      case 'number':
        text = String(cell.value);
        break;
      case 'boolean':
        text = cell.value ? 'TRUE' : 'FALSE';
        break;
      case 'date':
        text = cell.value.toISOString().slice(0, 10);
        break;
      default:
        return null;
    }
    if (maxLength !== undefined && text.length > maxLength) {
      return this.fail('TOO_LONG', col, `the text is ${text.length} characters long; at most ${maxLength} are allowed. Shorten it.`);
    }
    return text;
  }

  /** A coded cell; null when blank. Reports `code` with the list of accepted codes. */
  code<C extends string>(col: BoundColumn | undefined, codes: readonly CodeDef<C>[], problem: Parameters<ProblemList['error']>[0], what: string): Read<C> {
    const text = this.text(col);
    if (text === null || text === FAIL) return text;
    const code = matchCode(codes, text);
    if (code === undefined) {
      return this.fail(problem, col, `"${text}" is not a ${what} Sagline knows. Use one of: ${codes.map((c) => c.code).join(', ')}.`);
    }
    return code;
  }

  /**
   * A number in the column's unit, as SI; null when blank. Text holding a
   * number is read (CSV cells are text), with its own unit if it has one.
   */
  quantity(col: BoundColumn | undefined, dimension: Dimension, unit: UnitDef | undefined = col?.unit): Read<number> {
    if (!col) return null;
    if (!col.usable || !unit) return this.silentFail();
    const cell = this.resolve(col);
    if (cell === FAIL) return FAIL;
    switch (cell.kind) {
      case 'blank':
        return null;
      case 'number':
        return toSI(cell.value, unit.symbol);
      case 'text':
        return this.parseText(col, cell.text, dimension, unit);
      case 'date':
        return this.fail(
          'NOT_A_NUMBER',
          col,
          `the cell holds a date (${cell.value.toISOString().slice(0, 10)}) where a number in ${unit.display} is expected; the spreadsheet may have turned the entry into a date. Format the cell as a number and type the value again.`,
        );
      case 'boolean':
        return this.fail('NOT_A_NUMBER', col, `the cell holds ${cell.value ? 'TRUE' : 'FALSE'} where a number in ${unit.display} is expected. Type the number.`);
      default:
        return null;
    }
  }

  parseText(col: BoundColumn, text: string, dimension: Dimension, unit: UnitDef): Read<number> {
    try {
      return parseQuantity(text, dimension, unit.symbol).si;
    } catch (e) {
      if (!(e instanceof UnitError)) throw e;
      if (e.code === 'NOT_A_NUMBER' && !/decimal comma/.test(e.message)) {
        return this.fail('NOT_A_NUMBER', col, `"${text}" is not a number. Enter a number in ${unit.display} (the header's unit), e.g. ${exampleNumber(unit)}, or leave the cell empty if the column is optional.`);
      }
      return this.fail(e.code === 'WRONG_DIMENSION' ? 'WRONG_UNIT' : e.code === 'UNKNOWN_UNIT' ? 'UNKNOWN_UNIT' : 'NOT_A_NUMBER', col, e.message);
    }
  }

  /** A column whose header already failed: the row fails without a second report. */
  silentFail(): typeof FAIL {
    this.failed = true;
    return FAIL;
  }
}

function exampleNumber(unit: UnitDef): string {
  switch (unit.dimension) {
    case 'length':
      return unit.symbol === 'mm' ? '7200' : unit.symbol === 'in' ? '12' : '7.2';
    case 'stress':
      return unit.symbol === 'GPa' ? '200' : unit.symbol === 'ksi' ? '29000' : '200000';
    case 'inertia':
      return unit.symbol === '10^6 mm^4' ? '245' : unit.symbol === 'in^4' ? '590' : '245000000';
    default:
      return '12.5';
  }
}

/** "7.20 m" in the column's unit, for messages. */
export function shown(si: number, unit: UnitDef | undefined): string {
  return unit ? formatInUnit(fromSIDecimal(si, unit.symbol), unit.symbol, {}) : String(si);
}
