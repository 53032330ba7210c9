import { useMemo } from 'react';
import type { BeamInput, BeamReport } from '@sagline/common/engine';
import type { UnitSystemId } from '@sagline/common/units';
import { CurveLegend, layoutLegend } from './curve-legend';
import { DEFAULT_HEIGHT, DEFAULT_WIDTH, drawingFrame, formatFactor, px } from './drawing-geometry';
import { caseColours, curveStyle, drawingFont, drawingInk } from './drawing-style';
import { combinationFormula, deflectionText, lengthText, segmentWord, supportWord } from './drawing-text';
import { ElasticCurves, layoutCurves, type CurvesLayout } from './elastic-curves';
import { LoadLanes, layoutLoadLanes } from './load-lanes';
import { isCantilever, layoutElevation, MemberElevation, MEMBER_THICKNESS } from './member-elevation';

export interface BeamDrawingProps {
  /** The member, SI base units (calc-contract.md). */
  input: BeamInput;
  /** analyzeBeam(input): segments and each combination's extremes. */
  report: BeamReport;
  /** Units every length, load and deflection is written in. */
  unitSystem: UnitSystemId;
  /** Show only this combination's curve; default: every combination, each in its own style. */
  combination?: string;
  /** Drawing width, px (the SVG scales down to its container). Default 760. */
  width?: number;
  /**
   * Nominal drawing height, px: the largest drawn deflection is 15–20 % of it.
   * The drawing grows taller when its content needs more room. Default 420.
   */
  height?: number;
}

const PAD = 10;

/**
 * The member drawing of the Member screen: the member to scale with its
 * supports, spans and overhangs dimensioned, loads by load case, and the
 * elastic curve of each combination with each segment's extreme, all in the
 * project's units. Pure SVG; the y axis of the curves is inverted so that
 * an upward deflection (positive, calc-contract.md) is drawn up.
 */
export function BeamDrawing({ input, report, unitSystem, combination, width = DEFAULT_WIDTH, height = DEFAULT_HEIGHT }: BeamDrawingProps) {
  const scene = useMemo(() => {
    const frame = drawingFrame(width);
    const nominal = Number.isFinite(height) && height > 0 ? height : DEFAULT_HEIGHT;
    const length = input.length;
    const cases = [...new Set(input.loads.map((l) => l.case))];
    const colours = caseColours(cases);
    const lanes = layoutLoadLanes(input.loads, colours, length, frame, unitSystem);
    const elevation = layoutElevation(report.segments, input.supports, length, frame, unitSystem);
    const shown = combination !== undefined ? [combination] : Object.keys(input.combinations);
    const curves = layoutCurves(input, report, shown, frame, nominal, unitSystem);
    const legend = layoutLegend(
      curves.curves.map((c, i) => {
        const formula = combinationFormula(input.combinations[c.combination]);
        return { combination: c.combination, style: c.style ?? curveStyle(i), text: formula ? `${c.combination} (${formula})` : c.combination };
      }),
      frame,
    );

    const lanesY = PAD;
    const axisY = lanes.height > 0 ? lanesY + lanes.height - 8 + MEMBER_THICKNESS / 2 : PAD + elevation.above;
    let panelTop = axisY + elevation.below + 18;
    const contentTop = panelTop + curves.titleHeight;
    const contentHeight = curves.bottom - curves.top;
    const legendGap = 10;
    const needed = contentTop + contentHeight + legendGap + legend.height + PAD;
    const total = Math.max(nominal, Math.ceil(needed));
    // Spare height goes around the curve panel, so the curves sit mid-way in it.
    panelTop += (total - needed) / 2;
    const curveAxisY = panelTop + curves.titleHeight - curves.top;
    const legendY = curveAxisY + curves.bottom + legendGap;
    return { frame, lanes, elevation, curves, legend, axisY, lanesY, panelTop, curveAxisY, legendY, total, cantilever: isCantilever(input.supports) };
  }, [input, report, unitSystem, combination, width, height]);

  const { frame, total } = scene;
  const label = summary(input, report, unitSystem, scene.curves, scene.cantilever);
  return (
    <svg
      role="img"
      aria-label={label}
      xmlns="http://www.w3.org/2000/svg"
      width={frame.width}
      height={total}
      viewBox={`0 0 ${px(frame.width)} ${px(total)}`}
      style={{ maxWidth: '100%', height: 'auto', display: 'block', background: drawingInk.background }}
      fontFamily={drawingFont}
      data-testid="beam-drawing"
    >
      <title>{label}</title>
      <LoadLanes layout={scene.lanes} length={input.length} frame={frame} system={unitSystem} y={scene.lanesY} />
      <MemberElevation layout={scene.elevation} supports={input.supports} length={input.length} frame={frame} axisY={scene.axisY} />
      <ElasticCurves
        layout={scene.curves}
        supports={input.supports}
        length={input.length}
        frame={frame}
        top={scene.panelTop}
        axisY={scene.curveAxisY}
      />
      <CurveLegend layout={scene.legend} y={scene.legendY} />
    </svg>
  );
}

/** One paragraph a screen reader can read for the whole drawing. */
function summary(input: BeamInput, report: BeamReport, system: UnitSystemId, curves: CurvesLayout, cantilever: boolean): string {
  const parts: string[] = [];
  const supports = [...input.supports].sort((a, b) => a.x - b.x);
  parts.push(
    `Member ${lengthText(input.length, system)} long on ${supports.length} support${supports.length === 1 ? '' : 's'} (${supports
      .map((s) => `${supportWord(s.kind)} at ${lengthText(s.x, system)}`)
      .join(', ')})`,
  );
  if (report.segments.length) {
    parts.push(report.segments.map((s) => `${segmentWord(s, cantilever)} ${lengthText(s.to - s.from, system)}`).join(', '));
  }
  const cases = [...new Set(input.loads.map((l) => l.case))];
  parts.push(
    input.loads.length
      ? `${input.loads.length} load${input.loads.length === 1 ? '' : 's'} in case${cases.length === 1 ? '' : 's'} ${cases.join(', ')}`
      : 'no loads',
  );
  if (curves.factor !== null) parts.push(`elastic curves drawn with deflection × ${formatFactor(curves.factor)}`);
  for (const c of curves.curves) {
    const marks = curves.extremes.filter((m) => m.combination === c.combination).sort((a, b) => a.segment - b.segment);
    const segs = report.combinations[c.combination]?.segments ?? [];
    if (!marks.length) continue;
    parts.push(
      `${c.combination}: ${marks
        .map((m) => {
          const seg = segs[m.segment];
          return `${seg ? segmentWord(seg, cantilever) : 'segment'} ${m.segment + 1} ${deflectionText(m.deflection, system)}`;
        })
        .join(', ')}`,
    );
  }
  return parts.join('; ') + '.';
}
