/**
 * Serviceability limit sets: presets with the source of every rule, member
 * categories, and the helpers that turn a set into an engine BeamInput's
 * combinations and checks for one member. SI units (m) throughout.
 */
export type { LimitRule, LimitSet, LimitSetNote, MaterialId, MemberCategory, RuleSource, Trust } from './types';
export { MATERIAL_IDS } from './types';
export { MEMBER_CATEGORIES, findCategory } from './categories';
export { ACI_318_19, CUSTOM_BLANK, IBC_2021, LIMIT_SET_PRESETS, US_IBC_2021_ACI_318_19, findPreset } from './presets';
export { ACI_XI_BY_MONTHS, DEFAULT_LAMBDA_DELTA, aciLambdaDelta } from './aci-long-term';
export {
  VERDICT_CAUTION,
  buildBeamInput,
  checksFor,
  combinationName,
  describeSource,
  evaluateMember,
  type SourcedCheckReport,
  type ChecksForOptions,
  type MemberChecks,
  type MemberModel,
} from './checks-for';
export { FOOT, FT_13_6, INCH, IN_0_3, IN_1_4, IN_3_4 } from './lengths';
export { LIMIT_ERROR_CODES, LimitError, type LimitErrorCode } from './limit-error';
export { assertValidLimitSet, validateLimitSet, type LimitProblem } from './validate';
