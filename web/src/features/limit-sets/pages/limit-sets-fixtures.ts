import type { LimitPresetView, LimitSetRuleView, LimitSetsOverview, ProjectLimitSetView } from '@sagline/common/api-types';

/** A few rules of the IBC 2021 preset as the API shows them (common/src/limits/presets/ibc-2021.ts). */
const IBC = 'International Building Code (IBC)';
const FROM_MEMORY = 'Row verified in reproduced 2015/2018 code text; the 2021 row is assumed unchanged.';

export const floorLive: LimitSetRuleView = {
  id: 'floor.live',
  category: 'floor',
  check: 'L/360 live',
  combination: { L: 1 },
  combinationName: 'L',
  ratio: 360,
  maxAbs: null,
  plus: null,
  materials: null,
  lengthRange: null,
  longTermCases: null,
  source: { document: IBC, edition: '2021', clause: 'Table 1604.3, floor members, L column', trust: 'from memory', note: FROM_MEMORY },
  sourceText: 'IBC 2021, Table 1604.3, floor members, L column (from memory)',
};

export const floorTotalSteel: LimitSetRuleView = {
  id: 'floor.total.steel',
  category: 'floor',
  check: 'L/240 total',
  combination: { L: 1 },
  combinationName: 'L',
  ratio: 240,
  maxAbs: null,
  plus: null,
  materials: ['steel', 'cold-formed-steel'],
  lengthRange: null,
  longTermCases: null,
  source: { document: IBC, edition: '2021', clause: 'Table 1604.3, footnote g', trust: 'verified' },
  sourceText: 'IBC 2021, Table 1604.3, footnote g (verified)',
};

export const masonryTotal: LimitSetRuleView = {
  id: 'supports-masonry.total',
  category: 'supports-masonry',
  check: 'L/600 total, 0.3 in max',
  combination: { D: 1, L: 1 },
  combinationName: 'D+L',
  ratio: 600,
  maxAbs: 0.00762,
  plus: null,
  materials: null,
  lengthRange: null,
  longTermCases: null,
  source: { document: 'TMS 402, Building Code Requirements for Masonry Structures', edition: '2016 / 2022', clause: '§5.2.1.4 (number from memory)', trust: 'verified' },
  sourceText: 'TMS 402 2016 / 2022, §5.2.1.4 (verified)',
};

const categories = [
  { id: 'floor', label: 'Floor member', description: 'Beams, joists and girders of floors.' },
  { id: 'supports-masonry', label: 'Supports unreinforced masonry', description: 'Beams and lintels carrying unreinforced masonry.' },
];

export const ibcPreset: LimitPresetView = {
  id: 'ibc-2021',
  name: 'IBC 2021 (Table 1604.3, glass, masonry)',
  description: 'International Building Code 2021 §1604.3 / Table 1604.3.',
  categories,
  rules: [floorLive, floorTotalSteel, masonryTotal],
  notes: [{ text: 'Cantilevers: l is taken as twice the cantilever length.', sourceText: 'IBC 2021, Table 1604.3, cantilever footnote (verified)' }],
};

export const blankPreset: LimitPresetView = { id: 'custom', name: 'Custom (blank)', description: 'Project-specific criteria.', categories: [], rules: [], notes: [] };

export const activeSet: ProjectLimitSetView = {
  id: 11,
  name: 'US building: IBC 2021 + ACI 318-19',
  description: 'The set the project started with.',
  sourcePresetId: 'us-ibc-2021-aci-318-19',
  categories,
  rules: [floorLive, floorTotalSteel, masonryTotal],
  notes: [],
  caution: 'Results support checking; they do not replace the judgement of the engineer of record.',
  updatedAt: '2026-12-02T10:00:00.000Z',
  createdAt: '2026-12-02T10:00:00.000Z',
  version: 1,
  active: true,
};

export const stricterSet: ProjectLimitSetView = {
  ...activeSet,
  id: 12,
  name: 'Halvercote floors, stricter',
  sourcePresetId: 'ibc-2021',
  rules: [{ ...floorLive, ratio: 1500, check: 'L/1500 live' }, floorTotalSteel, masonryTotal],
  version: 2,
  active: false,
};

export const overview = (canEdit: boolean, extra: Partial<LimitSetsOverview> = {}): LimitSetsOverview => ({
  activeId: activeSet.id,
  presets: [ibcPreset, blankPreset],
  projectSets: [activeSet, stricterSet],
  results: { revisionId: 31, revisionNumber: 1, memberCount: 391, passCount: 363, failCount: 28, limitSetId: activeSet.id, limitSetName: activeSet.name, upToDate: true },
  openJob: null,
  canEdit,
  caution: activeSet.caution,
  ...extra,
});
