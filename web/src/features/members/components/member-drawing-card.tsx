import { useState } from 'react';
import { Flex, Segmented, Typography } from 'antd';
import type { MemberDetail } from '@sagline/common/api-types';
import { BeamDrawing } from '@/components/beam-drawing/beam-drawing';
import { combinationFormula } from './member-words';

const ALL = '__all__';

/**
 * The member to scale with its supports, spans, overhangs and loads by load
 * case, and the elastic curve of every combination (or of one), its
 * exaggeration stated and each segment's extreme marked.
 */
export function MemberDrawing({ detail }: { detail: MemberDetail }) {
  const combinations = Object.keys(detail.beamInput.combinations);
  const [shown, setShown] = useState<string>(ALL);
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
      <div style={{ border: '1px solid #e6ebee', borderRadius: 4, overflow: 'hidden' }}>
        <BeamDrawing input={detail.beamInput} report={detail.report} unitSystem={detail.unitSystem} combination={combination} width={920} />
      </div>
    </Flex>
  );
}
