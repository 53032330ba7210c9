import { US_IBC_2021_ACI_318_19, type LimitSet } from '../../common/src/limits';

/**
 * The limit set the demo members are sized against (the demo project's set):
 * IBC 2021 Table 1604.3 with ACI 318-19 for concrete, from common/src/limits.
 */
export const DEMO_LIMIT_SET: LimitSet = US_IBC_2021_ACI_318_19;

/** The limit-set category ids the demo workbooks use; all are categories of DEMO_LIMIT_SET. */
export const DEMO_CATEGORIES = [
  'floor',
  'roof-plaster-ceiling',
  'roof-nonplaster-ceiling',
  'roof-no-ceiling',
  'supports-masonry',
  'concrete-damage-prone',
  'supports-glass',
] as const;
