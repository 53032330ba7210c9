import {
  assignRows,
  deflectionToPx,
  drawableWidth,
  drawingFrame,
  exaggerationFactor,
  formatFactor,
  niceFloor,
  pathThrough,
  placeLabel,
  pxPerMetre,
  xToPx,
} from './drawing-geometry';

describe('horizontal scale', () => {
  it('puts the ends of the member on the margins and every metre at the same px', () => {
    const frame = drawingFrame(760);
    const k = pxPerMetre(9, frame);
    expect(xToPx(0, 9, frame)).toBe(frame.marginLeft);
    expect(xToPx(9, 9, frame)).toBeCloseTo(frame.width - frame.marginRight, 9);
    expect(xToPx(6, 9, frame) - xToPx(0, 9, frame)).toBeCloseTo((2 / 3) * drawableWidth(frame), 9);
    expect(xToPx(7, 9, frame) - xToPx(4, 9, frame)).toBeCloseTo(3 * k, 9);
  });

  it('falls back to the default width for a width that is not a positive number', () => {
    expect(drawingFrame(Number.NaN).width).toBe(760);
    expect(drawingFrame(-5).width).toBe(760);
  });
});

describe('exaggeration of the elastic curve', () => {
  it('rounds down to a nice number', () => {
    expect(niceFloor(130)).toBe(120);
    expect(niceFloor(120)).toBe(120);
    expect(niceFloor(99.9)).toBe(80);
    expect(niceFloor(1000)).toBe(1000);
    expect(niceFloor(0.7)).toBe(0.6);
    expect(niceFloor(0)).toBe(0);
  });

  it('draws the largest deflection at 15-20 % of the drawing height, whatever the member', () => {
    const height = 420;
    // Deflections from 0.01 mm to 2 m over members 0.5 m to 40 m long.
    for (const maxAbs of [1e-5, 3.3e-4, 0.0081, 0.0124, 0.05, 0.3, 2]) {
      for (const length of [0.5, 2.4, 7.2, 13, 40]) {
        const k = pxPerMetre(length, drawingFrame(760));
        const factor = exaggerationFactor(maxAbs, k, height);
        expect(factor).not.toBeNull();
        const share = Math.abs(deflectionToPx(maxAbs, k, factor)) / height;
        expect(share).toBeGreaterThanOrEqual(0.15);
        expect(share).toBeLessThanOrEqual(0.2 + 1e-12);
      }
    }
  });

  it('states no factor when nothing deflects', () => {
    expect(exaggerationFactor(0, 80, 420)).toBeNull();
    expect(exaggerationFactor(Number.NaN, 80, 420)).toBeNull();
    expect(deflectionToPx(-0.01, 80, null)).toBe(0);
  });

  it('draws a downward (negative) deflection down the screen and an upward one up', () => {
    expect(deflectionToPx(-0.01, 100, 120)).toBeCloseTo(120, 9);
    expect(deflectionToPx(0.01, 100, 120)).toBeCloseTo(-120, 9);
    expect(Object.is(deflectionToPx(0, 100, 120), 0)).toBe(true); // never "-0"
  });

  it('writes the factor as people read it', () => {
    expect(formatFactor(120)).toBe('120');
    expect(formatFactor(2.5)).toBe('2.5');
    expect(formatFactor(12000)).toBe('12,000');
    expect(formatFactor(0.0006)).toBe('0.0006');
  });
});

describe('label placement', () => {
  it('lifts a label that would touch another to the next row', () => {
    const rows = assignRows([
      { left: 0, right: 50 },
      { left: 40, right: 90 },
      { left: 100, right: 140 },
      { left: 45, right: 60 },
    ]);
    expect(rows).toEqual([0, 1, 0, 2]);
  });

  it('keeps a label inside the drawing and anchors it at the edge it touches', () => {
    expect(placeLabel(100, 40, 4, 756)).toEqual({ left: 80, right: 120, x: 100, anchor: 'middle' });
    expect(placeLabel(750, 40, 4, 756)).toEqual({ left: 716, right: 756, x: 756, anchor: 'end' });
    expect(placeLabel(2, 40, 4, 756)).toEqual({ left: 4, right: 44, x: 4, anchor: 'start' });
  });

  it('writes short path data without "-0"', () => {
    expect(pathThrough([
      [1.004, -0.001],
      [2.5, 3.14159],
    ])).toBe('M1 0 L2.5 3.14');
  });
});
