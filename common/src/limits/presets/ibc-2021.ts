import type { Combination } from '../../engine';
import { FT_13_6, IN_0_3, IN_1_4, IN_3_4 } from '../lengths';
import type { LimitRule, LimitSet, MaterialId, RuleSource } from '../types';

/**
 * IBC 2021 §1604.3 and Table 1604.3, with §1604.3.7 (framing supporting
 * glass), §2403.3 (glazing per pane) and the masonry limit of TMS 402 that
 * §1604.3.4 points to. Values and trust marks as in domain.md §2.1 and §2.5:
 * the table rows were verified in reproduced 2015/2018 text and are assumed
 * unchanged in 2021 (from memory), so every row says so.
 */

const IBC = 'International Building Code (IBC)';
const TABLE_NOTE = 'Row verified in reproduced 2015/2018 code text; the 2021 row is assumed unchanged. Check against the adopted edition and local amendments.';

const table = (clause: string, note = TABLE_NOTE): RuleSource => ({ document: IBC, edition: '2021', clause, trust: 'from memory', note });

const FN_D: RuleSource = {
  document: IBC,
  edition: '2021',
  clause: 'Table 1604.3, footnote d',
  trust: 'verified',
  note:
    'For lumber, glulam, I-joists and SCL installed dry and kept dry (NDS), the creep part of the dead-load deflection may be taken as the immediate deflection under 0.5D: L + 0.5D ≤ l/240 (2018 wording, verified; footnote letter as printed in 2015–2018). Not to be combined with the NDS Kcr method (from memory). Wet service: use D + L.',
};
const FN_G: RuleSource = {
  document: IBC,
  edition: '2021',
  clause: 'Table 1604.3, footnote g',
  trust: 'verified',
  note: 'For steel structural members the dead load is taken as zero in the D + L column (verified via quotations; letter as printed in 2015–2018).',
};
const FN_F = 'Wind taken as 0.42 × the component-and-cladding load for these limits (footnote f, verified: 0.7 × 0.6 since ASCE 7-10 moved wind to strength level).';

const STEEL: MaterialId[] = ['steel', 'cold-formed-steel'];
const WOOD: MaterialId[] = ['timber', 'engineered-wood'];

function rule(
  id: string,
  category: string,
  check: string,
  combination: Combination,
  ratio: number,
  source: RuleSource,
  extra: Partial<Pick<LimitRule, 'maxAbs' | 'plus' | 'materials' | 'lengthRange'>> = {},
): LimitRule {
  return {
    id,
    category,
    check,
    combination,
    ratio,
    maxAbs: extra.maxAbs ?? null,
    plus: extra.plus ?? null,
    materials: extra.materials ?? null,
    lengthRange: extra.lengthRange ?? null,
    longTermCases: null,
    source,
  };
}

/**
 * The D + L column of a row with its material variants: D + L in general,
 * L alone for steel (footnote g), L + 0.5D for dry seasoned wood (footnote d).
 * `live` is the live-type case of that column (L for floors; Lr or S for roofs).
 */
function totalWithVariants(category: string, check: string, idBase: string, live: string, ratio: number, clause: string): LimitRule[] {
  return [
    rule(`${idBase}`, category, check, { D: 1, [live]: 1 }, ratio, table(clause)),
    rule(`${idBase}.steel`, category, check, { [live]: 1 }, ratio, FN_G, { materials: STEEL }),
    rule(`${idBase}.wood`, category, check, { D: 0.5, [live]: 1 }, ratio, FN_D, { materials: WOOD }),
  ];
}

function roof(category: string, row: string, live: number, total: number): LimitRule[] {
  const clause = `Table 1604.3, roof members ${row}`;
  return [
    rule(`${category}.roof-live`, category, `L/${live} roof live`, { Lr: 1 }, live, table(clause)),
    rule(`${category}.snow`, category, `L/${live} snow`, { S: 1 }, live, table(`${clause}, S or W column`)),
    rule(`${category}.wind`, category, `L/${live} wind`, { W: 0.42 }, live, table(`${clause}, S or W column, footnote f`, `${TABLE_NOTE} ${FN_F}`)),
    ...totalWithVariants(category, `L/${total} total (D + Lr)`, `${category}.total-roof-live`, 'Lr', total, `${clause}, D + L column`),
    ...totalWithVariants(category, `L/${total} total (D + S)`, `${category}.total-snow`, 'S', total, `${clause}, D + L column`),
  ];
}

function wall(category: string, row: string, ratio: number): LimitRule {
  return rule(`${category}.wind`, category, `L/${ratio} wind`, { W: 0.42 }, ratio, table(`Table 1604.3, exterior walls ${row}, S or W column, footnote f`, `${TABLE_NOTE} ${FN_F}`));
}

const FN_A: RuleSource = {
  document: IBC,
  edition: '2021',
  clause: 'Table 1604.3, footnote a',
  trust: 'verified',
  note: 'Secondary roof members supporting formed metal roofing: live ≤ l/150; secondary wall members supporting formed metal siding: wind ≤ l/90. The roof part applies only where the sheets have no covering (verified; letter as printed in 2015–2018).',
};

const GLASS_FRAMING: RuleSource = {
  document: IBC,
  edition: '2021',
  clause: '§1604.3.7 Framing supporting glass',
  trust: 'verified',
  note: 'Content verified from the report of code change S69-16 (added in IBC 2018): under 0.6 × component-and-cladding wind, l/175 for members up to 13 ft 6 in, l/240 + 1/4 in for longer members. The section number is from memory.',
};

const GLAZING_PANE: RuleSource = {
  document: IBC,
  edition: '2021',
  clause: '§2403.3 Framing (glass supports)',
  trust: 'verified',
  note: 'Edge deflection of the framing of each pane ≤ 1/175 of the glass edge length or 3/4 in, whichever is less, loads combined per §1605 (verified in 2009–2015 text; assumed unchanged in 2021, from memory). Combination 0.6W as in domain.md §2.8 (component-and-cladding wind).',
};

const MASONRY: RuleSource = {
  document: 'TMS 402, Building Code Requirements for Masonry Structures',
  edition: '2016 / 2022',
  clause: '§5.2.1.4 (number from memory)',
  trust: 'verified',
  note: 'Beams and lintels supporting unreinforced masonry: D + L deflection ≤ l/600 and ≤ 0.3 in (7.62 mm). Values verified through quotations of ACI 530-88 §5.6 and ACI 530-02/05 §1.10.1, the predecessors of TMS 402; IBC §1604.3.4 sends masonry to TMS 402. The cap governs for spans above 15 ft (4.57 m).',
};

export const IBC_2021: LimitSet = {
  id: 'ibc-2021',
  name: 'IBC 2021 (Table 1604.3, glass, masonry)',
  description:
    'International Building Code 2021 §1604.3 / Table 1604.3 with the dead-load footnotes for steel and dry wood, framing supporting glass (§1604.3.7), glazing per pane (§2403.3) and members supporting unreinforced masonry (TMS 402). The adopted edition and local amendments govern.',
  categories: [
    'floor',
    'roof-plaster-ceiling',
    'roof-nonplaster-ceiling',
    'roof-no-ceiling',
    'roof-metal-secondary',
    'wall-plaster',
    'wall-brittle',
    'wall-flexible',
    'wall-metal-siding',
    'supports-masonry',
    'supports-glass',
    'glazing-pane',
  ],
  rules: [
    rule('floor.live', 'floor', 'L/360 live', { L: 1 }, 360, table('Table 1604.3, floor members, L column')),
    ...totalWithVariants('floor', 'L/240 total', 'floor.total', 'L', 240, 'Table 1604.3, floor members, D + L column'),
    ...roof('roof-plaster-ceiling', 'supporting plaster or stucco ceiling', 360, 240),
    ...roof('roof-nonplaster-ceiling', 'supporting nonplaster ceiling', 240, 180),
    ...roof('roof-no-ceiling', 'not supporting ceiling', 180, 120),
    rule('roof-metal-secondary.roof-live', 'roof-metal-secondary', 'L/150 roof live', { Lr: 1 }, 150, FN_A),
    wall('wall-plaster', 'with plaster or stucco finishes', 360),
    wall('wall-brittle', 'with other brittle finishes', 240),
    wall('wall-flexible', 'with flexible finishes', 120),
    rule('wall-metal-siding.wind', 'wall-metal-siding', 'L/90 wind', { W: 0.42 }, 90, { ...FN_A, note: `${FN_A.note} ${FN_F}` }),
    rule('supports-masonry.live', 'supports-masonry', 'L/360 live', { L: 1 }, 360, table('Table 1604.3, floor members, L column')),
    rule('supports-masonry.total', 'supports-masonry', 'L/600 total, 0.3 in max', { D: 1, L: 1 }, 600, MASONRY, { maxAbs: IN_0_3 }),
    rule('supports-glass.short', 'supports-glass', 'L/175 wind (up to 13 ft 6 in)', { W: 0.6 }, 175, GLASS_FRAMING, { lengthRange: { max: FT_13_6 } }),
    rule('supports-glass.long', 'supports-glass', 'L/240 + 1/4 in wind (over 13 ft 6 in)', { W: 0.6 }, 240, GLASS_FRAMING, {
      plus: IN_1_4,
      lengthRange: { min: FT_13_6 },
    }),
    rule('glazing-pane.wind', 'glazing-pane', 'L/175 wind, 3/4 in max', { W: 0.6 }, 175, GLAZING_PANE, { maxAbs: IN_3_4 }),
  ],
  notes: [
    {
      text: 'Cantilevers: l is taken as twice the cantilever length. The engine applies this to every overhang and cantilever segment.',
      source: {
        document: IBC,
        edition: '2021',
        clause: 'Table 1604.3, cantilever footnote (letter i from memory)',
        trust: 'verified',
        note: 'The same sentence is note b of IRC Table R301.7 (verified).',
      },
    },
    {
      text: 'These limits do not guard against ponding: check ponding separately (§1611 and §1503.4).',
      source: { document: IBC, edition: '2021', clause: 'Table 1604.3, footnote e', trust: 'verified' },
    },
    {
      text: 'The more restrictive of these limits and the material standard (ACI 318 for concrete, AISC 360 / AISI S100 / SJI for steel, TMS 402 for masonry, AA ADM for aluminium) governs.',
      source: { document: IBC, edition: '2021', clause: '§1604.3.2–§1604.3.5', trust: 'verified', note: 'Verified in 2012-era text.' },
    },
  ],
};
