/**
 * The coded values a schedule cell may hold. These are Sagline's own codes;
 * matching is case-insensitive and tolerant of spaces, underscores and hyphens.
 */
export interface CodeDef<C extends string = string> {
  readonly code: C;
  readonly label: string;
  readonly help: string;
  readonly aliases: readonly string[];
}

export const SUPPORT_CODES = [
  {
    code: 'pinned',
    label: 'Pinned (simple)',
    help: 'A pin at each end of the spans and at every interior support; overhangs are free. The default when the cell is empty.',
    aliases: ['simple', 'simply supported', 'pin', 'pin-pin', 'pinned-pinned', 'ss'],
  },
  {
    code: 'fixed-fixed',
    label: 'Fixed both ends',
    help: 'The first and last supports restrain rotation (built in); interior supports of continuous spans are pins.',
    aliases: ['fixed', 'fixed both ends', 'ff', 'built-in'],
  },
  {
    code: 'fixed-pinned',
    label: 'Fixed left, pinned right',
    help: 'The left end support is fixed, every other support is a pin (a propped member).',
    aliases: ['fp', 'fixed-pin'],
  },
  {
    code: 'pinned-fixed',
    label: 'Pinned left, fixed right',
    help: 'The right end support is fixed, every other support is a pin (a propped member).',
    aliases: ['pf', 'pin-fixed'],
  },
  {
    code: 'cantilever-left',
    label: 'Cantilever fixed at the left end',
    help: 'One fixed support at the left end (x = 0), free at the right. Spans holds the cantilever length; no overhangs.',
    aliases: ['fixed-free', 'cantilever'],
  },
  {
    code: 'cantilever-right',
    label: 'Cantilever fixed at the right end',
    help: 'One fixed support at the right end, free at the left. Spans holds the cantilever length; no overhangs.',
    aliases: ['free-fixed'],
  },
] as const satisfies readonly CodeDef[];
export type SupportCode = (typeof SUPPORT_CODES)[number]['code'];

export const MATERIALS = [
  { code: 'steel', label: 'Steel (hot-rolled or built-up)', help: 'Structural steel.', aliases: ['structural steel'] },
  { code: 'cold-formed-steel', label: 'Cold-formed steel', help: 'Light-gauge steel framing.', aliases: ['cfs', 'light gauge steel', 'light-gauge steel'] },
  { code: 'timber', label: 'Timber (sawn)', help: 'Sawn lumber or solid timber.', aliases: ['wood', 'lumber', 'sawn timber'] },
  {
    code: 'engineered-wood',
    label: 'Engineered wood',
    help: 'Glulam, LVL, PSL, I-joists and other engineered wood. CLT and deep members need shear deformation, which the engine ignores.',
    aliases: ['glulam', 'lvl', 'psl', 'lsl', 'i-joist', 'scl', 'clt'],
  },
  { code: 'concrete', label: 'Concrete', help: 'Reinforced or prestressed concrete; enter the effective I you want checked.', aliases: ['rc', 'reinforced concrete', 'precast', 'pt'] },
  { code: 'masonry', label: 'Masonry', help: 'Masonry lintels and beams.', aliases: ['brick', 'block', 'cmu'] },
  { code: 'aluminium', label: 'Aluminium', help: 'Aluminium framing.', aliases: ['aluminum', 'alu'] },
  { code: 'other', label: 'Other', help: 'Any other material; say which in Notes.', aliases: [] },
] as const satisfies readonly CodeDef[];
export type MaterialCode = (typeof MATERIALS)[number]['code'];

/**
 * Load case labels (the usual letters of ASCE 7 §2.3 and IBC §1602: D dead, L
 * live, Lr roof live, S snow, R rain, W wind). Limit-set combinations refer
 * to these labels; a column for any other label would be silently unused, so
 * the parser rejects it.
 */
export const LOAD_CASES = [
  { code: 'D', label: 'Dead', help: 'Dead load: self-weight, finishes, services, superimposed dead load.', aliases: ['dead', 'dead load', 'DL'] },
  { code: 'L', label: 'Live', help: 'Floor live (imposed) load.', aliases: ['live', 'live load', 'LL', 'imposed'] },
  { code: 'Lr', label: 'Roof live', help: 'Roof live load (maintenance, construction).', aliases: ['roof live', 'roof live load', 'RLL'] },
  { code: 'S', label: 'Snow', help: 'Snow load.', aliases: ['snow', 'snow load', 'SL'] },
  { code: 'R', label: 'Rain', help: 'Rain load.', aliases: ['rain', 'rain load'] },
  { code: 'W', label: 'Wind', help: 'Wind load on the member (positive downward, negative for uplift).', aliases: ['wind', 'wind load', 'WL'] },
] as const satisfies readonly CodeDef[];
export type LoadCaseCode = (typeof LOAD_CASES)[number]['code'];

export const LOAD_KINDS = [
  { code: 'point', label: 'Point load', help: 'A concentrated force P at Position (positive downward).', aliases: ['concentrated', 'point load', 'p', 'conc'] },
  { code: 'udl', label: 'Uniform load over part', help: 'A uniform line load w from From to To (both default to the member ends).', aliases: ['uniform', 'partial', 'partial udl', 'distributed'] },
  { code: 'linear', label: 'Linearly varying load', help: 'A line load varying from Value at From to End value at To (triangular or trapezoidal).', aliases: ['varying', 'triangular', 'trapezoidal', 'linear load'] },
  { code: 'moment', label: 'Concentrated moment', help: 'A couple M at Position, positive counter-clockwise (x to the right, y up).', aliases: ['couple', 'moment load', 'm'] },
] as const satisfies readonly CodeDef[];
export type LoadKindCode = (typeof LOAD_KINDS)[number]['code'];

/** The matching key of a code or header word: lower case, letters and digits only. */
export function wordKey(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]/g, '');
}

/** The code a cell text means, or undefined. */
export function matchCode<C extends string>(codes: readonly CodeDef<C>[], text: string): C | undefined {
  const key = wordKey(text);
  if (key === '') return undefined;
  for (const def of codes) {
    if (wordKey(def.code) === key || def.aliases.some((a) => wordKey(a) === key)) return def.code;
  }
  return undefined;
}
