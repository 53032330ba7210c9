import { render, screen } from '@testing-library/react';
import { analyzeBeam, type BeamInput } from '@sagline/common/engine';
import { formatQuantity } from '@sagline/common/units';
import { BeamDrawing } from './beam-drawing';
import { drawableWidth, drawingFrame, pxPerMetre } from './drawing-geometry';

/**
 * What a checker sees in the member drawing. Reference values are handbook
 * formulas (AISC Steel Construction Manual, 15th ed., Table 3-23; from memory),
 * not the engine's own numbers, so a sign or scale slip in the drawing shows.
 */

const E = 200e9;
const I = 80e-6;
const WIDTH = 760;
const frame = drawingFrame(WIDTH);

function draw(input: BeamInput, opts: { unitSystem?: 'SI' | 'US'; combination?: string; height?: number } = {}) {
  const report = analyzeBeam(input);
  const { container } = render(
    <BeamDrawing input={input} report={report} unitSystem={opts.unitSystem ?? 'SI'} combination={opts.combination} width={WIDTH} height={opts.height} />,
  );
  const svg = container.querySelector('svg') as SVGSVGElement;
  return { svg, report };
}

function num(el: Element | null, attr: string): number {
  if (!el) throw new Error(`no element for ${attr}`);
  return Number(el.getAttribute(attr));
}

/** The points of an "M x y L x y …" path. */
function pathPoints(d: string): Array<[number, number]> {
  return [...d.matchAll(/[ML](-?[\d.]+) (-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
}

/** The apex (top point) of each pin support triangle, left to right. */
function pinApexes(svg: SVGSVGElement): number[] {
  return [...svg.querySelectorAll('[data-testid="support"] polygon')]
    .map((p) => Number((p.getAttribute('points') ?? '').split(' ')[0].split(',')[0]))
    .sort((a, b) => a - b);
}

function allAttributes(svg: SVGSVGElement): string[] {
  return [svg, ...svg.querySelectorAll('*')].flatMap((el) => [...el.attributes].map((a) => `${el.tagName}.${a.name}=${a.value}`));
}

function visibleTexts(svg: SVGSVGElement): string[] {
  return [...svg.querySelectorAll('text')].map((t) => t.textContent ?? '');
}

const simpleSpan = (w: number, L = 6): BeamInput => ({
  length: L,
  E,
  I,
  supports: [
    { x: 0, kind: 'pin' },
    { x: L, kind: 'pin' },
  ],
  loads: [{ case: 'D', kind: 'udl', x1: 0, x2: L, w }],
  combinations: { total: { D: 1 } },
});

/** A 4.5 m back span with a 1.8 m overhang carrying a 3 kN end load (a balcony edge). */
const balcony = (): BeamInput => ({
  length: 6.3,
  E,
  I,
  supports: [
    { x: 0, kind: 'pin' },
    { x: 4.5, kind: 'pin' },
  ],
  loads: [
    { case: 'D', kind: 'udl', x1: 4.5, x2: 6.3, w: 3500 },
    { case: 'L', kind: 'point', x: 6.3, P: 3000 },
  ],
  combinations: { live: { L: 1 }, total: { D: 1, L: 1 } },
});

describe('BeamDrawing: to scale', () => {
  it('draws supports 6 m and 9 m along a 9 m member at 2/3 and 3/3 of the drawable width', () => {
    const input: BeamInput = {
      length: 9,
      E,
      I,
      supports: [
        { x: 0, kind: 'pin' },
        { x: 6, kind: 'pin' },
        { x: 9, kind: 'pin' },
      ],
      loads: [{ case: 'L', kind: 'point', x: 4.5, P: 10000 }],
      combinations: { live: { L: 1 } },
    };
    const { svg } = draw(input);
    const [a, b, c] = pinApexes(svg);
    const w = drawableWidth(frame);
    expect((a - frame.marginLeft) / w).toBeCloseTo(0, 3);
    expect((b - frame.marginLeft) / w).toBeCloseTo(2 / 3, 3);
    expect((c - frame.marginLeft) / w).toBeCloseTo(1, 3);
    // The member bar spans the same width, and the point load at 4.5 m sits at half of it.
    const member = svg.querySelector('[data-testid="member"]');
    expect(num(member, 'width') / w).toBeCloseTo(1, 3);
    const arrow = svg.querySelector('[data-testid="load"][data-kind="point"] line');
    expect((num(arrow, 'x1') - frame.marginLeft) / w).toBeCloseTo(0.5, 3);
    // Both spans are dimensioned, and the whole length.
    const dims = visibleTexts(svg).filter((t) => / m( |$)/.test(t));
    expect(dims).toEqual(expect.arrayContaining(['6.00 m', '3.00 m', '9.00 m overall']));
  });

  it("reads an overhang's length in m, or in ft on a US project", () => {
    expect(visibleTexts(draw(balcony()).svg)).toEqual(expect.arrayContaining(['4.50 m', '1.80 m overhang', '6.30 m overall']));
    document.body.innerHTML = '';
    // 1.80 m = 5.905… ft and 4.50 m = 14.76… ft (1 ft = 0.3048 m exactly).
    expect(visibleTexts(draw(balcony(), { unitSystem: 'US' }).svg)).toEqual(
      expect.arrayContaining(['14.8 ft', '5.91 ft overhang', '20.7 ft overall']),
    );
  });

  it('calls a lone fixed support with its free length a cantilever', () => {
    const input: BeamInput = {
      length: 2.4,
      E,
      I,
      supports: [{ x: 0, kind: 'fixed' }],
      loads: [{ case: 'D', kind: 'point', x: 2.4, P: 2000 }],
      combinations: { total: { D: 1 } },
    };
    const { svg } = draw(input);
    expect(visibleTexts(svg)).toContain('2.40 m cantilever');
    expect(svg.querySelector('[data-testid="support"]')?.getAttribute('data-kind')).toBe('fixed');
  });
});

describe('BeamDrawing: elastic curve', () => {
  it('draws a simply supported beam under a downward udl sagging below the support line, labelled with 5wL⁴/384EI', () => {
    const w = 4000;
    const L = 6;
    const { svg } = draw(simpleSpan(w, L));
    const axisY = num(svg.querySelector('[data-testid="curve-axis"]'), 'y1');
    const curve = svg.querySelector('[data-testid="elastic-curve"][data-combination="total"]');
    const points = pathPoints(curve?.getAttribute('d') ?? '');
    expect(points.length).toBeGreaterThan(100);
    const midX = frame.marginLeft + drawableWidth(frame) / 2;
    const mid = points.reduce((best, p) => (Math.abs(p[0] - midX) < Math.abs(best[0] - midX) ? p : best));
    expect(mid[1]).toBeGreaterThan(axisY + 20); // below the supports on screen (y grows down)
    // The ends stay on the support line.
    expect(points[0][1]).toBeCloseTo(axisY, 1);
    expect(points[points.length - 1][1]).toBeCloseTo(axisY, 1);
    // AISC Table 3-23 case 1: Δmax = 5wl⁴/384EI at midspan.
    const expected = (5 * w * L ** 4) / (384 * E * I);
    expect(screen.getByText(`${formatQuantity(expected, 'deflection', 'SI')} down`)).toBeInTheDocument();
    const dot = svg.querySelector('[data-testid="curve-extreme"]');
    expect(num(dot, 'cy')).toBeGreaterThan(axisY);
  });

  it('lifts the back span of a loaded overhang: its extreme is drawn above the support line and labelled "up"', () => {
    const input = balcony();
    input.loads = [{ case: 'L', kind: 'point', x: 6.3, P: 3000 }];
    input.combinations = { live: { L: 1 } };
    const { svg } = draw(input);
    const axisY = num(svg.querySelector('[data-testid="curve-axis"]'), 'y1');
    const back = svg.querySelector('[data-testid="curve-extreme"][data-segment="0"]');
    const tip = svg.querySelector('[data-testid="curve-extreme"][data-segment="1"]');
    expect(num(back, 'cy')).toBeLessThan(axisY - 5);
    expect(num(tip, 'cy')).toBeGreaterThan(axisY + 5);
    // AISC Table 3-23 case 24 (overhang, end load P): Δ between supports = 0.06415·P·a·l²/EI, upward,
    // at x = l/√3; at the free end Δ = P·a²(l + a)/3EI, downward.
    const P = 3000;
    const l = 4.5;
    const a = 1.8;
    const up = (0.06415 * P * a * l ** 2) / (E * I);
    const down = (P * a ** 2 * (l + a)) / (3 * E * I);
    const labels = [...svg.querySelectorAll('[data-testid="curve-extreme-label"]')].map((t) => t.textContent);
    expect(labels).toEqual(
      expect.arrayContaining([`${formatQuantity(up, 'deflection', 'SI')} up`, `${formatQuantity(down, 'deflection', 'SI')} down`]),
    );
    expect(num(back, 'cx')).toBeCloseTo(frame.marginLeft + (l / Math.sqrt(3)) * pxPerMetre(6.3, frame), 0);
  });

  it('states the one factor every curve is drawn with, and the largest deflection fills 15-20 % of the height', () => {
    const { svg, report } = draw(balcony(), { height: 420 });
    const text = screen.getByTestId('curve-scale').textContent ?? '';
    const match = /deflection × ([\d,.]+)/.exec(text);
    expect(match).not.toBeNull();
    const stated = Number(match![1].replace(/,/g, ''));
    const axisY = num(svg.querySelector('[data-testid="curve-axis"]'), 'y1');
    const k = pxPerMetre(6.3, frame);
    let largest = 0;
    for (const dot of svg.querySelectorAll('[data-testid="curve-extreme"]')) {
      const combination = dot.getAttribute('data-combination') as string;
      const segment = Number(dot.getAttribute('data-segment'));
      const d = report.combinations[combination].segments[segment].extreme.deflection;
      const drawn = axisY - num(dot, 'cy'); // px up
      expect(drawn / (d * k)).toBeCloseTo(stated, 0);
      largest = Math.max(largest, Math.abs(drawn));
    }
    expect(largest / 420).toBeGreaterThanOrEqual(0.15);
    expect(largest / 420).toBeLessThanOrEqual(0.2);
  });

  it('gives every combination its own curve, style and legend entry, or only the one asked for', () => {
    const { svg } = draw(balcony());
    const curves = [...svg.querySelectorAll('[data-testid="elastic-curve"]')];
    expect(curves.map((c) => c.getAttribute('data-combination'))).toEqual(['live', 'total']);
    expect(new Set(curves.map((c) => `${c.getAttribute('stroke')}|${c.getAttribute('stroke-dasharray')}`)).size).toBe(2);
    const legend = [...svg.querySelectorAll('[data-testid="legend-item"]')].map((g) => g.textContent);
    expect(legend).toEqual(['live (1 L)', 'total (1 D + 1 L)']);
    // With several curves each extreme label says whose it is.
    expect(visibleTexts(svg).some((t) => /^total: .* (up|down)$/.test(t))).toBe(true);
    document.body.innerHTML = '';

    const one = draw(balcony(), { combination: 'total' }).svg;
    expect([...one.querySelectorAll('[data-testid="elastic-curve"]')].map((c) => c.getAttribute('data-combination'))).toEqual(['total']);
  });

  it('says so, instead of failing, when asked for a combination the member does not have', () => {
    const { svg } = draw(balcony(), { combination: 'snow' });
    expect(svg.querySelectorAll('[data-testid="elastic-curve"]')).toHaveLength(0);
    expect(screen.getByTestId('curve-note').textContent).toMatch(/snow/);
  });
});

describe('BeamDrawing: loads and units', () => {
  const mixed = (): BeamInput => ({
    length: 9,
    E,
    I,
    supports: [
      { x: 0, kind: 'pin' },
      { x: 7.2, kind: 'pin' },
    ],
    loads: [
      { case: 'D', kind: 'udl', x1: 0, x2: 9, w: 3500 },
      { case: 'L', kind: 'udl', x1: 0, x2: 7.2, w: 6000 },
      { case: 'L', kind: 'point', x: 9, P: 5000 },
      { case: 'D', kind: 'linear', x1: 1, x2: 4, w1: 0, w2: 2000 },
      { case: 'W', kind: 'moment', x: 7.2, M: 1500 },
      { case: 'W', kind: 'point', x: 3, P: -2000 },
    ],
    combinations: { live: { L: 1 }, total: { D: 1, L: 1 }, wind: { W: 1 } },
  });

  it('groups loads by case, each lane tagged with its case label, each value with its unit', () => {
    const { svg } = draw(mixed());
    const lanes = [...svg.querySelectorAll('[data-testid="load-lane"]')];
    // D has two overlapping distributed loads, so it takes two lanes; each lane shows its label.
    expect(lanes.map((l) => l.getAttribute('data-case'))).toEqual(['D', 'D', 'L', 'W']);
    for (const lane of lanes) expect(lane.querySelector('text')?.textContent).toBe(lane.getAttribute('data-case'));
    const values = [...svg.querySelectorAll('[data-testid="load-label"]')].map((t) => t.textContent);
    expect(values).toEqual(
      expect.arrayContaining(['3.50 kN/m', '6.00 kN/m', '5.00 kN', '0 → 2.00 kN/m', '1.50 kN·m CCW', '2.00 kN up']),
    );
  });

  it('writes US projects in ft, in, plf, kip and kip·ft', () => {
    const { svg } = draw(mixed(), { unitSystem: 'US' });
    const texts = visibleTexts(svg);
    // 3.5 kN/m = 239.8 plf; 5 kN = 1.124 kip; 1.5 kN·m = 1.106 kip·ft; 7.2 m = 23.62 ft.
    expect(texts).toEqual(expect.arrayContaining(['240 plf', '1.12 kip', '1.11 kip·ft CCW', '23.6 ft']));
    expect(texts.some((t) => /^\w+: \d+\.\d+ in (up|down)$/.test(t))).toBe(true);
    expect(texts.some((t) => / (m|mm|kN)\b/.test(t))).toBe(false);
  });

  it('never shows a person a negative sign, and never writes NaN or Infinity into the SVG', () => {
    const noLoads: BeamInput = { ...simpleSpan(0), loads: [], combinations: { total: { D: 1 } } };
    const cantilever: BeamInput = {
      length: 2.4,
      E,
      I,
      supports: [{ x: 0, kind: 'fixed' }],
      loads: [{ case: 'D', kind: 'udl', x1: 0, x2: 2.4, w: -1500 }],
      combinations: { total: { D: 1 } },
    };
    for (const input of [mixed(), balcony(), noLoads, cantilever]) {
      for (const unitSystem of ['SI', 'US'] as const) {
        const { svg } = draw(input, { unitSystem });
        const bad = allAttributes(svg).filter((a) => /NaN|Infinity|undefined/.test(a));
        expect(bad).toEqual([]);
        for (const t of visibleTexts(svg)) expect(t).not.toMatch(/[-−]\s?\d/);
        document.body.innerHTML = '';
      }
    }
  });

  it('draws a flat curve and says nothing deflects when a combination has no load', () => {
    const { svg } = draw({ ...simpleSpan(0), loads: [], combinations: { total: { D: 1 } } });
    expect(screen.getByTestId('curve-scale').textContent).toMatch(/no deflection/);
    const points = pathPoints(svg.querySelector('[data-testid="elastic-curve"]')?.getAttribute('d') ?? '');
    expect(new Set(points.map((p) => p[1])).size).toBe(1);
    expect(svg.querySelectorAll('[data-testid="curve-extreme"]')).toHaveLength(0);
  });

  it('summarises the member for a screen reader', () => {
    draw(balcony());
    const img = screen.getByRole('img');
    const label = img.getAttribute('aria-label') ?? '';
    expect(label).toMatch(/^Member 6\.30 m long on 2 supports \(pin at 0\.00 m, pin at 4\.50 m\)/);
    expect(label).toMatch(/span 4\.50 m, overhang 1\.80 m/);
    expect(label).toMatch(/2 loads in cases D, L/);
    expect(label).toMatch(/deflection × \d+/);
    expect(label).toMatch(/live: span 1 [\d.]+ mm up, overhang 2 [\d.]+ mm down/);
  });
});
