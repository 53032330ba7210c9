import { solveAndCombine } from './analyze';
import { EngineError } from './engine-error';
import type { BeamInput, Combination, PointDeflection } from './types';

/**
 * Points of the elastic curve of one combination, for drawing: `count`
 * evenly spaced points from 0 to length plus every support and load point,
 * ascending. Values are exact (m, positive up); the sampling is only for the
 * picture — extremes come from analyzeBeam. `combination` is a name of
 * input.combinations or the factors themselves.
 */
export function deflectionCurve(input: BeamInput, combination: string | Combination, count = 101): PointDeflection[] {
  const factors = typeof combination === 'string' ? input.combinations[combination] : combination;
  if (factors === undefined) {
    throw new EngineError('UNKNOWN_COMBINATION', 'combination', `Combination "${String(combination)}" is not defined in this member's combinations.`);
  }
  const { sol, curve } = solveAndCombine(input, factors);
  const n = Math.max(2, Math.floor(count));
  const xs: number[] = [];
  for (let i = 0; i < n; i++) xs.push(i === n - 1 ? input.length : (input.length * i) / (n - 1));
  for (let j = 0; j < sol.nNodes; j++) xs.push(sol.nodeX[j]);
  for (const l of input.loads) {
    if (l.kind === 'point' || l.kind === 'moment') xs.push(l.x);
    else xs.push(l.x1, l.x2);
  }
  xs.sort((a, b) => a - b);
  const out: PointDeflection[] = [];
  for (const x of xs) {
    if (out.length && out[out.length - 1].x === x) continue;
    const g = sol.segmentAt(x);
    out.push({ x, deflection: curve.at(g, sol.localT(g, x)) + 0 });
  }
  return out;
}
