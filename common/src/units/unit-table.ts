import type { Dimension } from './dimensions';
import { ExactDecimal as D, type Decimal } from './exact';

export type UnitSystemId = 'SI' | 'US';

/** One unit the schedule and the screens accept. */
export interface UnitDef {
  /** Canonical symbol: what headers, stored data and `normalizeUnit` use. */
  readonly symbol: string;
  /** How screens print it after a number ("kN·m", "×10⁶ mm⁴", "in⁴"). */
  readonly display: string;
  readonly name: string;
  readonly dimension: Dimension;
  readonly system: UnitSystemId;
  /** The SI base value of one of this unit, exactly. */
  readonly factor: Decimal;
  /** Other spellings accepted on input (matched after `unitKey` normalisation). */
  readonly aliases: readonly string[];
  /** Decimals `formatQuantity` never goes below / above for this unit. */
  readonly minDecimals: number;
  readonly maxDecimals: number;
}

// Exact definitions. Domain notes (section 1, exact factors) and NIST SP 811
// (2008) Appendix B, from memory: the international foot and inch (1959) and
// the pound-force from the avoirdupois pound and standard gravity.
const FT = new D('0.3048');
const IN = new D('0.0254');
const LBF = new D('4.4482216152605');
const KIP = LBF.times(1000);

type Row = [
  symbol: string,
  display: string,
  name: string,
  dimension: Dimension,
  system: UnitSystemId,
  factor: Decimal,
  minDecimals: number,
  maxDecimals: number,
  aliases: string[],
];

const ROWS: Row[] = [
  // length
  ['m', 'm', 'metre', 'length', 'SI', new D(1), 2, 3, ['metre', 'metres', 'meter', 'meters']],
  ['mm', 'mm', 'millimetre', 'length', 'SI', new D('0.001'), 0, 1, ['millimetre', 'millimetres', 'millimeter', 'millimeters']],
  ['cm', 'cm', 'centimetre', 'length', 'SI', new D('0.01'), 0, 2, ['centimetre', 'centimetres', 'centimeter', 'centimeters']],
  ['ft', 'ft', 'foot', 'length', 'US', FT, 1, 2, ["'", '′', 'foot', 'feet']],
  ['in', 'in', 'inch', 'length', 'US', IN, 0, 2, ['"', '″', 'inch', 'inches']],
  // force
  ['N', 'N', 'newton', 'force', 'SI', new D(1), 0, 1, ['newton', 'newtons']],
  ['kN', 'kN', 'kilonewton', 'force', 'SI', new D(1000), 0, 2, ['kilonewton', 'kilonewtons']],
  ['lbf', 'lb', 'pound-force', 'force', 'US', LBF, 0, 0, ['lb', 'lbs', 'pound', 'pounds', '#']],
  ['kip', 'kip', 'kip (1000 lbf)', 'force', 'US', KIP, 0, 2, ['kips', 'k', 'klb', 'klbf']],
  // line load
  ['N/m', 'N/m', 'newton per metre', 'lineLoad', 'SI', new D(1), 0, 0, []],
  ['kN/m', 'kN/m', 'kilonewton per metre', 'lineLoad', 'SI', new D(1000), 0, 2, []],
  ['N/mm', 'N/mm', 'newton per millimetre', 'lineLoad', 'SI', new D(1000), 0, 2, []],
  ['plf', 'plf', 'pound-force per foot', 'lineLoad', 'US', LBF.div(FT), 0, 0, ['lb/ft', 'lbf/ft', 'lbs/ft', '#/ft', 'pounds per foot']],
  ['klf', 'klf', 'kip per foot', 'lineLoad', 'US', KIP.div(FT), 0, 3, ['kip/ft', 'kips/ft', 'k/ft']],
  ['pli', 'pli', 'pound-force per inch', 'lineLoad', 'US', LBF.div(IN), 0, 1, ['lb/in', 'lbf/in', 'lbs/in']],
  // moment
  ['N·m', 'N·m', 'newton metre', 'moment', 'SI', new D(1), 0, 0, ['Nm', 'N-m', 'N*m', 'N m']],
  ['kN·m', 'kN·m', 'kilonewton metre', 'moment', 'SI', new D(1000), 0, 2, ['kNm', 'kN-m', 'kN*m', 'kN m']],
  ['N·mm', 'N·mm', 'newton millimetre', 'moment', 'SI', new D('0.001'), 0, 0, ['Nmm', 'N-mm', 'N*mm', 'N mm']],
  ['lbf·ft', 'lb·ft', 'pound-force foot', 'moment', 'US', LBF.times(FT), 0, 0, ['lb-ft', 'lb·ft', 'lb*ft', 'lbf-ft', 'lbf*ft', 'ft-lb', 'ft·lb', 'ft-lbf', 'lb ft']],
  ['lbf·in', 'lb·in', 'pound-force inch', 'moment', 'US', LBF.times(IN), 0, 0, ['lb-in', 'lb·in', 'lb*in', 'lbf-in', 'in-lb', 'in·lb', 'in-lbf']],
  ['kip·ft', 'kip·ft', 'kip foot', 'moment', 'US', KIP.times(FT), 0, 2, ['kip-ft', 'kip*ft', 'k-ft', 'k·ft', 'ft-kip', 'ft·kip', 'ft-k', 'kipft', 'kft', 'kip ft']],
  ['kip·in', 'kip·in', 'kip inch', 'moment', 'US', KIP.times(IN), 0, 1, ['kip-in', 'kip*in', 'k-in', 'in-kip', 'in-k', 'kip in']],
  // stress and modulus
  ['Pa', 'Pa', 'pascal', 'stress', 'SI', new D(1), 0, 0, ['N/m^2', 'pascal', 'pascals']],
  ['kPa', 'kPa', 'kilopascal', 'stress', 'SI', new D(1000), 0, 2, ['kN/m^2']],
  ['MPa', 'MPa', 'megapascal', 'stress', 'SI', new D('1e6'), 0, 1, ['N/mm^2']],
  ['GPa', 'GPa', 'gigapascal', 'stress', 'SI', new D('1e9'), 0, 1, ['kN/mm^2']],
  ['psi', 'psi', 'pound-force per square inch', 'stress', 'US', LBF.div(IN.pow(2)), 0, 0, ['lb/in^2', 'lbf/in^2', 'lbs/in^2']],
  ['ksi', 'ksi', 'kip per square inch', 'stress', 'US', KIP.div(IN.pow(2)), 0, 0, ['kip/in^2', 'kips/in^2', 'k/in^2']],
  ['psf', 'psf', 'pound-force per square foot', 'stress', 'US', LBF.div(FT.pow(2)), 0, 1, ['lb/ft^2', 'lbf/ft^2', 'lbs/ft^2']],
  // moment of inertia (second moment of area)
  ['mm^4', 'mm⁴', 'millimetre to the fourth', 'inertia', 'SI', new D('1e-12'), 0, 0, []],
  ['cm^4', 'cm⁴', 'centimetre to the fourth', 'inertia', 'SI', new D('1e-8'), 0, 1, []],
  ['10^6 mm^4', '×10⁶ mm⁴', 'million millimetres to the fourth', 'inertia', 'SI', new D('1e-6'), 0, 2, ['1e6 mm4', 'x10^6 mm^4', 'mm^4 x 10^6', 'e6 mm^4']],
  ['m^4', 'm⁴', 'metre to the fourth', 'inertia', 'SI', new D(1), 0, 12, []],
  ['in^4', 'in⁴', 'inch to the fourth', 'inertia', 'US', IN.pow(4), 0, 1, []],
];

export const UNITS: readonly UnitDef[] = ROWS.map(
  ([symbol, display, name, dimension, system, factor, minDecimals, maxDecimals, aliases]) =>
    Object.freeze({ symbol, display, name, dimension, system, factor, minDecimals, maxDecimals, aliases: Object.freeze(aliases) }),
);

const SUPERSCRIPT_DIGITS = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/**
 * The lookup key of a unit spelling: case-insensitive, superscripts written
 * as powers, any product separator (space, ·, *, -) written as one "·",
 * "mm4" as "mm^4" and "1e6"/"x10^6" as a "10^6" prefix. Two spellings with the
 * same key mean the same unit.
 */
export function unitKey(text: string): string {
  let s = text.trim();
  s = s.replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹]+/g, (m) => '^' + [...m].map((c) => SUPERSCRIPT_DIGITS.indexOf(c)).join(''));
  s = s.toLowerCase();
  s = s.replace(/[×✕]/g, 'x').replace(/[⋅∙•*]/g, '·').replace(/′/g, "'").replace(/″/g, '"');
  // "in." and "lb." are common abbreviations with a full stop.
  s = s.replace(/\.$/, '');
  s = s.replace(/\s*([/^])\s*/g, '$1');
  // The "×10^6" factor of a million mm^4, before or after the unit.
  s = s.replace(/^(?:x\s*)?(?:10\^\+?6|1e\+?6|e\+?6)\s*·?\s*/, '10^6·');
  s = s.replace(/^(.+?)\s*[x·]\s*10\^\+?6$/, '10^6·$1');
  s = s.replace(/[\s·-]+/g, '·');
  s = s.replace(/([a-z])(\d)/g, '$1^$2');
  return s.replace(/^·+|·+$/g, '');
}

const BY_KEY = new Map<string, UnitDef>();
for (const unit of UNITS) {
  for (const spelling of [unit.symbol, unit.display, ...unit.aliases]) {
    const key = unitKey(spelling);
    const known = BY_KEY.get(key);
    if (known && known !== unit) {
      throw new Error(`unit table: "${spelling}" means both ${known.symbol} and ${unit.symbol}`);
    }
    BY_KEY.set(key, unit);
  }
}

// Imports look up the same few header spellings for every cell; remember them.
const SEEN = new Map<string, UnitDef | null>();

/** The unit a spelling means, or undefined when we do not know it. */
export function findUnit(text: string): UnitDef | undefined {
  let def = SEEN.get(text);
  if (def === undefined) {
    def = BY_KEY.get(unitKey(text)) ?? null;
    if (SEEN.size < 10_000) SEEN.set(text, def);
  }
  return def ?? undefined;
}

/** Every accepted spelling (for tests and help pages). */
export function unitSpellings(): ReadonlyMap<string, UnitDef> {
  return BY_KEY;
}
