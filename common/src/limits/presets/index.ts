import type { LimitSet } from '../types';
import { ACI_318_19 } from './aci-318-19';
import { IBC_2021 } from './ibc-2021';

export { ACI_318_19 } from './aci-318-19';
export { IBC_2021 } from './ibc-2021';

/** IBC 2021 and ACI 318-19 together: one set for a US project with steel, wood, masonry-bearing and concrete members. */
export const US_IBC_2021_ACI_318_19: LimitSet = {
  id: 'us-ibc-2021-aci-318-19',
  name: 'US building: IBC 2021 + ACI 318-19',
  description: `${IBC_2021.description} Concrete categories: ${ACI_318_19.description}`,
  categories: [...IBC_2021.categories, ...ACI_318_19.categories],
  rules: [...IBC_2021.rules, ...ACI_318_19.rules],
  notes: [...IBC_2021.notes, ...ACI_318_19.notes],
};

/** A blank set to copy and fill in: the engineer of record's own criteria. */
export const CUSTOM_BLANK: LimitSet = {
  id: 'custom',
  name: 'Custom (blank)',
  description: "Project-specific criteria chosen by the engineer of record. Add categories and rules with their sources.",
  categories: [],
  rules: [],
  notes: [],
};

/** Every preset, in the order a picker shows them. */
export const LIMIT_SET_PRESETS: readonly LimitSet[] = [IBC_2021, ACI_318_19, US_IBC_2021_ACI_318_19, CUSTOM_BLANK];

/** The preset with this id, or undefined. */
export function findPreset(id: string): LimitSet | undefined {
  return LIMIT_SET_PRESETS.find((s) => s.id === id);
}
