/**
 * The limit-set category ids the demo workbooks use. They must be ids of the
 * presets in common/src/limits (MEMBER_CATEGORIES); make-samples.ts checks
 * that when that module is present.
 */
export const DEMO_CATEGORIES = [
  'floor',
  'roof-plaster-ceiling',
  'roof-other-ceiling',
  'roof-no-ceiling',
  'supports-masonry',
  'concrete-damage-prone',
  'concrete-not-damage-prone',
  'glazing-support',
] as const;
