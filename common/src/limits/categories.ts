import type { MemberCategory } from './types';

/**
 * Member categories the presets use (domain.md §2.8). Ids are stable keys
 * (stored with members); labels are our own wording.
 */
export const MEMBER_CATEGORIES: readonly MemberCategory[] = [
  { id: 'floor', label: 'Floor member', materialHint: null, description: 'Beams, joists and girders of floors.' },
  {
    id: 'roof-plaster-ceiling',
    label: 'Roof member, plaster or stucco ceiling below',
    materialHint: null,
    description: 'Roof members supporting a plaster or stucco ceiling.',
  },
  {
    id: 'roof-nonplaster-ceiling',
    label: 'Roof member, other ceiling below',
    materialHint: null,
    description: 'Roof members supporting a ceiling that is not plaster (e.g. gypsum board, tiles).',
  },
  { id: 'roof-no-ceiling', label: 'Roof member, no ceiling', materialHint: null, description: 'Roof members not supporting a ceiling.' },
  {
    id: 'roof-metal-secondary',
    label: 'Secondary roof member under metal roofing',
    materialHint: 'steel',
    description: 'Purlins and other secondary members supporting formed metal roofing with no covering.',
  },
  { id: 'wall-plaster', label: 'Exterior wall member, plaster or stucco', materialHint: null, description: 'Girts and studs of exterior walls with plaster or stucco finishes, under wind.' },
  { id: 'wall-brittle', label: 'Exterior wall member, other brittle finish', materialHint: null, description: 'Girts and studs of exterior walls with brittle finishes, under wind.' },
  { id: 'wall-flexible', label: 'Exterior wall member, flexible finish', materialHint: null, description: 'Girts and studs of exterior walls with flexible finishes, under wind.' },
  {
    id: 'wall-metal-siding',
    label: 'Secondary wall member under metal siding',
    materialHint: 'steel',
    description: 'Girts and other secondary wall members supporting formed metal siding, under wind.',
  },
  {
    id: 'supports-masonry',
    label: 'Supports unreinforced masonry',
    materialHint: null,
    description: 'Beams and lintels carrying unreinforced masonry.',
  },
  {
    id: 'supports-glass',
    label: 'Framing supporting glass',
    materialHint: 'aluminium',
    description: 'Framing members that support glass (mullions, transoms, edge beams), under wind.',
  },
  { id: 'glazing-pane', label: 'Glazing frame, per pane', materialHint: 'aluminium', description: 'The framing of each glass pane, edge deflection.' },
  { id: 'concrete-floor', label: 'Concrete floor, no damage-prone elements', materialHint: 'concrete', description: 'Floors not supporting or attached to nonstructural elements likely to be damaged by large deflections.' },
  { id: 'concrete-flat-roof', label: 'Concrete flat roof, no damage-prone elements', materialHint: 'concrete', description: 'Flat roofs not supporting or attached to nonstructural elements likely to be damaged by large deflections.' },
  {
    id: 'concrete-damage-prone',
    label: 'Concrete, supports damage-prone elements',
    materialHint: 'concrete',
    description: 'Roofs or floors supporting or attached to nonstructural elements likely to be damaged by large deflections.',
  },
  {
    id: 'concrete-not-damage-prone',
    label: 'Concrete, supports elements not likely to be damaged',
    materialHint: 'concrete',
    description: 'Roofs or floors supporting or attached to nonstructural elements not likely to be damaged by large deflections.',
  },
];

/** The category with this id, or undefined. */
export function findCategory(id: string): MemberCategory | undefined {
  return MEMBER_CATEGORIES.find((c) => c.id === id);
}
