import { analyzeBeam, type BeamInput, type BeamReport, type Load, type Support } from '../../../common/src/engine';

/** A steel-like member with non-round stiffness, so no case passes by coincidence. E in Pa, I in m^4. */
export const E = 2.05e11;
export const I = 8.7e-5;
export const EI = E * I;

/** A load without its case (distributes over the union, unlike a plain Omit). */
export type CaselessLoad = Load extends infer T ? (T extends Load ? Omit<T, 'case'> : never) : never;

/** One-combination member: every load in case "D", combination "D". */
export function solveMember(length: number, supports: Support[], loads: CaselessLoad[], probes: number[] = []): BeamReport {
  const input: BeamInput = {
    length,
    E,
    I,
    supports,
    loads: loads.map((l) => ({ ...l, case: 'D' }) as Load),
    combinations: { D: { D: 1 } },
    probes,
  };
  return analyzeBeam(input);
}

/** The extreme of segment `s` of the only combination. */
export function extremeOf(report: BeamReport, s = 0): { x: number; deflection: number; kind: string } {
  const seg = report.combinations.D.segments[s];
  return { x: seg.extreme.x, deflection: seg.extreme.deflection, kind: seg.kind };
}

/** |actual − expected| ≤ tol·|expected| (tol defaults to the contract's 1e-9). */
export function expectRel(actual: number, expected: number, tol = 1e-9): void {
  const err = Math.abs(actual - expected);
  const scale = Math.abs(expected);
  if (!(err <= tol * scale)) {
    throw new Error(`expected ${expected}, got ${actual} (relative error ${scale === 0 ? err : err / scale}, allowed ${tol})`);
  }
}

export const pin = (x: number): Support => ({ x, kind: 'pin' });
export const fixed = (x: number): Support => ({ x, kind: 'fixed' });
