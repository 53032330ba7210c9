import { useEffect, useRef, useState } from 'react';
import { Flex, Segmented, Typography } from 'antd';
import type { MemberDetail } from '@sagline/common/api-types';
import { BeamDrawing } from '@/components/beam-drawing/beam-drawing';
import { combinationFormula } from './member-words';

const ALL = '__all__';
/** The drawing's width when its box cannot be measured (tests, first paint). */
const FALLBACK_WIDTH = 760;

/**
 * The width of the box, so the drawing is laid out at the size it is shown
 * (its text then keeps its size instead of being scaled with the picture).
 */
function useBoxWidth() {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const el = ref.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(([entry]) => {
      const w = Math.floor(entry.contentRect.width);
      // Step by 40 px so a scrollbar coming and going does not relayout the drawing.
      setWidth((old) => (Math.abs(old - w) >= 40 || old === 0 ? w : old));
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return { ref, width: width > 320 ? width : FALLBACK_WIDTH };
}

/**
 * The member to scale with its supports, spans, overhangs and loads by load
 * case, and the elastic curve of every combination (or of one), its
 * exaggeration stated and each segment's extreme marked.
 */
export function MemberDrawing({ detail }: { detail: MemberDetail }) {
  const combinations = Object.keys(detail.beamInput.combinations);
  const [shown, setShown] = useState<string>(ALL);
  const box = useBoxWidth();
  const combination = shown === ALL || !combinations.includes(shown) ? undefined : shown;
  return (
    <Flex vertical gap={8}>
      {combinations.length > 1 && (
        <Flex gap={8} align="center" wrap>
          <Typography.Text type="secondary">Elastic curve of</Typography.Text>
          <Segmented<string>
            aria-label="Elastic curve of"
            size="small"
            value={shown}
            onChange={setShown}
            options={[
              { value: ALL, label: 'every combination' },
              ...combinations.map((c) => {
                const formula = combinationFormula(detail.beamInput.combinations[c]);
                return { value: c, label: c, title: formula && formula !== c ? formula : undefined };
              }),
            ]}
          />
        </Flex>
      )}
      <div ref={box.ref} style={{ border: '1px solid #e6ebee', borderRadius: 4, overflow: 'hidden' }}>
        <BeamDrawing
          input={detail.beamInput}
          report={detail.report}
          unitSystem={detail.unitSystem}
          combination={combination}
          width={Math.min(box.width - 2, 1400)}
        />
      </div>
    </Flex>
  );
}
