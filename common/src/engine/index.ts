/**
 * The deflection engine: a general linear-elastic Euler–Bernoulli beam solver
 * in SI base units (calc-contract.md). Pure: no I/O, no framework.
 */
export type {
  BeamInput,
  BeamReport,
  Check,
  CheckReport,
  CheckSegmentResult,
  Combination,
  CombinationReport,
  Contribution,
  LinearLoad,
  Load,
  LoadKind,
  MomentLoad,
  PointDeflection,
  PointLoad,
  Reaction,
  Segment,
  SegmentKind,
  SegmentReport,
  Support,
  SupportKind,
  UdlLoad,
} from './types';
export { ENGINE_ERROR_CODES, EngineError, type EngineErrorCode } from './engine-error';
export { parseBeamInput } from './parse-input';
export { analyzeBeam, checkBeam } from './analyze';
export { checkSegment, effectiveLength } from './checks';
export { deflectionCurve } from './curve';
