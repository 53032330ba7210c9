import type { BeamLoad, BeamSupport, ScheduleMember } from './types';

/** Total length of the member, m: left overhang + spans + right overhang (a cantilever: its length). */
export function memberLength(member: ScheduleMember): number {
  if (member.supports === 'cantilever-left' || member.supports === 'cantilever-right') return member.spans[0];
  return member.leftOverhang + member.spans.reduce((a, b) => a + b, 0) + member.rightOverhang;
}

/**
 * The member's length and supports in the engine's shape (calc-contract.md):
 * x from the left end, which is the tip of the left overhang when there is one.
 * - pinned: a pin at every support;
 * - fixed-fixed / fixed-pinned / pinned-fixed: the first and/or last support
 *   fixed, interior supports pins;
 * - cantilever-left / cantilever-right: one fixed support at x = 0 / x = length.
 */
export function memberSupports(member: ScheduleMember): { length: number; supports: BeamSupport[] } {
  const length = memberLength(member);
  if (member.supports === 'cantilever-left') return { length, supports: [{ x: 0, kind: 'fixed' }] };
  if (member.supports === 'cantilever-right') return { length, supports: [{ x: length, kind: 'fixed' }] };
  const xs = [member.leftOverhang];
  for (const span of member.spans) xs.push(xs[xs.length - 1] + span);
  const leftFixed = member.supports === 'fixed-fixed' || member.supports === 'fixed-pinned';
  const rightFixed = member.supports === 'fixed-fixed' || member.supports === 'pinned-fixed';
  const supports: BeamSupport[] = xs.map((x, i) => ({
    x,
    kind: (i === 0 && leftFixed) || (i === xs.length - 1 && rightFixed) ? 'fixed' : 'pin',
  }));
  return { length, supports };
}

/** The member's loads in the engine's shape, without their workbook origin. */
export function memberLoads(member: ScheduleMember): BeamLoad[] {
  return member.loads.map((load): BeamLoad => {
    switch (load.kind) {
      case 'udl':
        return { case: load.case, kind: 'udl', x1: load.x1, x2: load.x2, w: load.w };
      case 'point':
        return { case: load.case, kind: 'point', x: load.x, P: load.P };
      case 'linear':
        return { case: load.case, kind: 'linear', x1: load.x1, x2: load.x2, w1: load.w1, w2: load.w2 };
      case 'moment':
        return { case: load.case, kind: 'moment', x: load.x, M: load.M };
    }
  });
}

/** The member part of an engine BeamInput (add combinations, probes and checks from the limit set). */
export function memberBeamInput(member: ScheduleMember): { length: number; E: number; I: number; supports: BeamSupport[]; loads: BeamLoad[] } {
  const { length, supports } = memberSupports(member);
  return { length, E: member.E, I: member.I, supports, loads: memberLoads(member) };
}
