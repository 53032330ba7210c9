import type { BeamInput, Load, Support } from '../src/engine';

/**
 * A deterministic, realistic mix of members for the benchmark: 1–3 spans of
 * 3–12 m, sometimes an overhang at either end or both, some cantilevers and
 * fixed or propped ends; 2–8 loads of every kind (full and partial uniform,
 * point, linear, moment) in cases D, L and W; 3 combinations and 2 checks.
 * Invented numbers in SI (steel-like E, I from 20e-6 to 500e-6 m^4).
 */

/** mulberry32: a small seeded generator, so every run sees the same members. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function makeMember(rand: () => number): BeamInput {
  const between = (a: number, b: number): number => a + (b - a) * rand();
  const round = (v: number): number => Math.round(v * 1000) / 1000;
  const supports: Support[] = [];
  let length: number;
  const shape = rand();
  if (shape < 0.1) {
    length = round(between(1, 4));
    supports.push({ x: 0, kind: 'fixed' });
  } else {
    const spans = 1 + Math.floor(rand() * 3);
    const left = rand() < 0.2 ? round(between(0.5, 3)) : 0;
    const right = rand() < 0.25 ? round(between(0.5, 3)) : 0;
    let x = left;
    supports.push({ x, kind: 'pin' });
    for (let s = 0; s < spans; s++) {
      x = round(x + between(3, 12));
      supports.push({ x, kind: 'pin' });
    }
    length = round(x + right);
    if (shape > 0.85 && left === 0) supports[0].kind = 'fixed';
    if (shape > 0.92 && right === 0) supports[supports.length - 1].kind = 'fixed';
  }
  const loads: Load[] = [{ case: 'D', kind: 'udl', x1: 0, x2: length, w: round(between(1000, 8000)) }];
  const extra = 1 + Math.floor(rand() * 7);
  for (let i = 0; i < extra; i++) {
    const c = rand() < 0.45 ? 'L' : rand() < 0.8 ? 'D' : 'W';
    const k = rand();
    const a = round(between(0, length));
    const b = round(between(0, length));
    const x1 = Math.min(a, b);
    const x2 = Math.max(a, b) > x1 ? Math.max(a, b) : length;
    if (k < 0.35) loads.push({ case: c, kind: 'udl', x1, x2: x2 > x1 ? x2 : length, w: round(between(500, 12000)) });
    else if (k < 0.7) loads.push({ case: c, kind: 'point', x: a, P: round(between(1000, 60000)) });
    else if (k < 0.9) loads.push({ case: c, kind: 'linear', x1, x2: x2 > x1 ? x2 : length, w1: round(between(0, 6000)), w2: round(between(0, 6000)) });
    else loads.push({ case: c, kind: 'moment', x: a, M: round(between(-20000, 20000)) });
  }
  if (!loads.some((l) => l.case === 'L')) loads.push({ case: 'L', kind: 'udl', x1: 0, x2: length, w: round(between(1000, 6000)) });
  const hasW = loads.some((l) => l.case === 'W');
  return {
    length,
    E: 200e9,
    I: round(between(20, 500)) * 1e-6,
    supports,
    loads,
    combinations: {
      live: { L: 1 },
      total: hasW ? { D: 1, L: 1, W: 0.42 } : { D: 1, L: 1 },
      'long-term': { D: 0.5, L: 1 },
    },
    checks: [
      { name: 'L/360 live', combination: 'live', ratio: 360, maxAbs: null },
      { name: 'L/240 total', combination: 'total', ratio: 240, maxAbs: rand() < 0.3 ? 0.02 : null },
    ],
  };
}
