import { deflectionCurve, type BeamInput, type BeamReport, type PointDeflection, type Support } from '@sagline/common/engine';
import type { UnitSystemId } from '@sagline/common/units';
import {
  deflectionToPx,
  drawableWidth,
  estimateTextWidth,
  exaggerationFactor,
  formatFactor,
  pathThrough,
  placeLabel,
  px,
  pxPerMetre,
  xToPx,
  type DrawingFrame,
  type Extent,
  type LabelBox,
} from './drawing-geometry';
import { curveStyle, drawingFont, drawingInk, type CurveStyle } from './drawing-style';
import { deflectionText } from './drawing-text';

/**
 * The elastic curve of each shown combination, drawn about the undeformed
 * axis with one exaggeration factor for the whole drawing, each segment's
 * extreme marked with a dot and a worded label ("12.4 mm down").
 * All y values of the layout are offsets from the axis, px, positive DOWN.
 */

const LABEL_FONT = 11;
const LABEL_STEP = 13;
const TITLE_HEIGHT = 22;

export interface ExtremeMark {
  combination: string;
  segment: number;
  x: number;
  deflection: number;
  /** Dot, px (x absolute, y from the axis). */
  cx: number;
  cy: number;
  text: string;
  box: LabelBox;
  /** Text baseline from the axis, px. */
  textY: number;
}

export interface CurveLayout {
  combination: string;
  style: CurveStyle;
  points: Array<[number, number]>;
}

export interface CurvesLayout {
  curves: CurveLayout[];
  extremes: ExtremeMark[];
  /** One factor for every curve of the drawing; null when nothing deflects. */
  factor: number | null;
  /** The scale as stated in the drawing ("Elastic curve, deflection × 120"). */
  scaleText: string;
  /** What the factor applies to, after the title or on a line of its own. */
  scaleNote: string;
  noteInline: boolean;
  /** Messages instead of a curve (unknown combination, engine refusal). */
  notes: string[];
  /** Extent of the content about the axis, px (top ≤ 0 ≤ bottom). */
  top: number;
  bottom: number;
  /** Height of the title line above the content, px. */
  titleHeight: number;
}

/** Points per curve: about one every 3 px of member, at least 121 (the engine adds support and load points). */
export function curvePointCount(frame: DrawingFrame): number {
  return Math.max(121, Math.ceil(drawableWidth(frame) / 3));
}

export function layoutCurves(
  input: BeamInput,
  report: BeamReport,
  combinations: readonly string[],
  frame: DrawingFrame,
  drawingHeight: number,
  system: UnitSystemId,
): CurvesLayout {
  const notes: string[] = [];
  const k = pxPerMetre(input.length, frame);
  const sampled: Array<{ name: string; index: number; points: PointDeflection[] }> = [];
  combinations.forEach((name, index) => {
    try {
      sampled.push({ name, index, points: deflectionCurve(input, name, curvePointCount(frame)) });
    } catch (e) {
      notes.push(`No curve for "${name}": ${e instanceof Error ? e.message : String(e)}`);
    }
  });

  let maxAbs = 0;
  for (const s of sampled) {
    for (const p of s.points) if (Number.isFinite(p.deflection)) maxAbs = Math.max(maxAbs, Math.abs(p.deflection));
    for (const seg of report.combinations[s.name]?.segments ?? []) {
      if (Number.isFinite(seg.extreme.deflection)) maxAbs = Math.max(maxAbs, Math.abs(seg.extreme.deflection));
    }
  }
  const factor = exaggerationFactor(maxAbs, k, drawingHeight);
  const X = (x: number) => xToPx(x, input.length, frame);
  const Y = (d: number) => deflectionToPx(d, k, factor);

  const curves: CurveLayout[] = sampled.map((s) => ({
    combination: s.name,
    style: curveStyle(s.index),
    points: s.points.filter((p) => Number.isFinite(p.deflection)).map((p) => [X(p.x), Y(p.deflection)] as [number, number]),
  }));

  // Extremes: a dot on the curve and a label outside every curve (below a sag,
  // above a bulge), the largest first so it sits nearest its dot; a label that
  // would touch another moves further out, one row at a time, on a leader.
  const many = sampled.length > 1;
  const candidates: Array<Omit<ExtremeMark, 'textY'>> = [];
  const tiny = maxAbs * 1e-6;
  for (const s of sampled) {
    (report.combinations[s.name]?.segments ?? []).forEach((seg, segment) => {
      const d = seg.extreme.deflection;
      if (!Number.isFinite(d) || !Number.isFinite(seg.extreme.x) || Math.abs(d) <= tiny) return;
      const cx = X(seg.extreme.x);
      const words = deflectionText(d, system);
      // An extreme that rounds to zero at display precision is not worth a mark.
      if (!/ (up|down)$/.test(words)) return;
      const text = `${many ? `${s.name}: ` : ''}${words}`;
      const box = placeLabel(cx, estimateTextWidth(text, LABEL_FONT), 4, frame.width - 4);
      candidates.push({ combination: s.name, segment, x: seg.extreme.x, deflection: d, cx, cy: Y(d), text, box });
    });
  }
  candidates.sort((a, b) => Math.abs(b.deflection) - Math.abs(a.deflection));
  const boxes: Array<{ box: Extent; top: number; bottom: number }> = [];
  const extremes: ExtremeMark[] = [];
  for (const c of candidates) {
    const down = c.deflection < 0;
    let outer = c.cy;
    for (const curve of curves) {
      for (const [x, y] of curve.points) {
        if (x < c.box.left - 2 || x > c.box.right + 2) continue;
        outer = down ? Math.max(outer, y) : Math.min(outer, y);
      }
    }
    let textY = down ? outer + 15 : outer - 8;
    for (let tries = 0; tries < 16; tries++) {
      const clash = boxes.some(
        (b) => c.box.left < b.box.right + 6 && b.box.left < c.box.right + 6 && textY - 10 < b.bottom && b.top < textY + 3,
      );
      if (!clash) break;
      textY += down ? LABEL_STEP : -LABEL_STEP;
    }
    boxes.push({ box: c.box, top: textY - 10, bottom: textY + 3 });
    extremes.push({ ...c, textY });
  }

  let top = -12;
  let bottom = 22; // support marks under the axis
  for (const c of curves) {
    for (const [, y] of c.points) {
      top = Math.min(top, y - 4);
      bottom = Math.max(bottom, y + 4);
    }
  }
  for (const b of boxes) {
    top = Math.min(top, b.top - 2);
    bottom = Math.max(bottom, b.bottom + 2);
  }
  const scaleText =
    factor === null ? 'Elastic curve: no deflection under the loads shown' : `Elastic curve, deflection × ${formatFactor(factor)}`;
  const scaleNote = factor === null ? '' : 'vertical scale only; lengths to scale';
  // The note follows the title on one line when it fits, else takes a line of its own.
  const noteInline =
    estimateTextWidth(`${scaleText}  (${scaleNote})`, 12) <= frame.width - frame.marginLeft - 4 || scaleNote === '';
  const titleHeight = TITLE_HEIGHT + (noteInline ? 0 : 14) + notes.length * 14;
  return { curves, extremes, factor, scaleText, scaleNote, noteInline, notes, top, bottom, titleHeight };
}

interface CurvesProps {
  layout: CurvesLayout;
  supports: readonly Support[];
  length: number;
  frame: DrawingFrame;
  /** Screen y of the panel top (title line) and of the undeformed axis, px. */
  top: number;
  axisY: number;
}

export function ElasticCurves({ layout, supports, length, frame, top, axisY }: CurvesProps) {
  const X = (x: number) => xToPx(x, length, frame);
  return (
    <g data-testid="elastic-curves" data-factor={layout.factor ?? ''}>
      <text x={px(frame.marginLeft)} y={px(top + 13)} fontSize={12} fill={drawingInk.muted}>
        <tspan fontWeight={600} data-testid="curve-scale">
          {layout.scaleText}
        </tspan>
        {layout.scaleNote ? (
          layout.noteInline ? (
            <tspan fontSize={11}>{`  (${layout.scaleNote})`}</tspan>
          ) : (
            <tspan fontSize={11} x={px(frame.marginLeft)} dy={14}>{`(${layout.scaleNote})`}</tspan>
          )
        ) : null}
      </text>
      {layout.notes.map((n, i) => (
        <text
          key={i}
          x={px(frame.marginLeft)}
          y={px(top + 27 + (layout.noteInline ? 0 : 14) + i * 14)}
          fontSize={11}
          fill={drawingInk.text}
          data-testid="curve-note"
        >
          {n}
        </text>
      ))}
      <line
        data-testid="curve-axis"
        x1={px(X(0))}
        y1={px(axisY)}
        x2={px(X(length))}
        y2={px(axisY)}
        stroke={drawingInk.axis}
        strokeWidth={1}
        strokeDasharray="5 4"
      />
      {supports.map((s, i) => {
        const x = X(s.x);
        return (
          <g key={i} data-testid="curve-support" data-kind={s.kind}>
            {s.kind === 'pin' ? (
              <polygon points={`${px(x)},${px(axisY)} ${px(x - 6)},${px(axisY + 10)} ${px(x + 6)},${px(axisY + 10)}`} fill={drawingInk.support} />
            ) : (
              <rect x={px(x - 2)} y={px(axisY - 10)} width={4} height={20} fill={drawingInk.support} />
            )}
          </g>
        );
      })}
      {layout.curves.map((c) => (
        <path
          key={c.combination}
          data-testid="elastic-curve"
          data-combination={c.combination}
          d={pathThrough(c.points.map(([x, y]) => [x, axisY + y] as const))}
          fill="none"
          stroke={c.style.colour}
          strokeWidth={2}
          strokeDasharray={c.style.dash}
          strokeLinejoin="round"
          strokeLinecap="round"
        />
      ))}
      {/* Layers: leaders, then dots, then labels on a pale ground, so a leader runs under other labels. */}
      {layout.extremes.map((m) =>
        Math.abs(m.textY - m.cy) > 18 ? (
          <line
            key={`leader-${m.combination}-${m.segment}`}
            x1={px(m.cx)}
            y1={px(axisY + m.cy)}
            x2={px(Math.min(Math.max(m.cx, m.box.left + 4), m.box.right - 4))}
            y2={px(axisY + (m.deflection < 0 ? m.textY - 10 : m.textY + 3))}
            stroke={colourOf(layout, m.combination)}
            strokeWidth={0.8}
          />
        ) : null,
      )}
      {layout.extremes.map((m) => (
        <circle
          key={`dot-${m.combination}-${m.segment}`}
          data-testid="curve-extreme"
          data-combination={m.combination}
          data-segment={m.segment}
          cx={px(m.cx)}
          cy={px(axisY + m.cy)}
          r={3.5}
          fill={colourOf(layout, m.combination)}
          stroke="#ffffff"
          strokeWidth={1.2}
        />
      ))}
      {layout.extremes.map((m) => (
        <g key={`label-${m.combination}-${m.segment}`}>
          <rect
            x={px(m.box.left - 2)}
            y={px(axisY + m.textY - 10)}
            width={px(m.box.right - m.box.left + 4)}
            height={13}
            rx={2}
            fill={drawingInk.background}
            fillOpacity={0.88}
          />
          <text
            x={px(m.box.x)}
            textAnchor={m.box.anchor}
            y={px(axisY + m.textY)}
            fontSize={LABEL_FONT}
            fontWeight={500}
            fill={drawingInk.text}
            fontFamily={drawingFont}
            data-testid="curve-extreme-label"
            data-combination={m.combination}
            data-segment={m.segment}
          >
            {m.text}
          </text>
        </g>
      ))}
    </g>
  );
}

function colourOf(layout: CurvesLayout, combination: string): string {
  return layout.curves.find((c) => c.combination === combination)?.style.colour ?? drawingInk.text;
}
