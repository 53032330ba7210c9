import { Col, Flex, Row, Statistic, Typography } from 'antd';
import type { ImportPreview } from '@sagline/common/api-types';
import { CautionNote } from '@/components/caution-note';

/** Members of the draft and their verdicts, with the limit set they come from and the caution. */
export function DraftSummary({ preview }: { preview: ImportPreview }) {
  const { summary } = preview;
  return (
    <Flex vertical gap={8}>
      <Row gutter={[16, 8]} role="group" aria-label="Verdicts of the draft">
        <Col xs={12} md={5}>
          <Statistic title="Members" value={preview.memberCount} />
        </Col>
        <Col xs={12} md={5}>
          <Statistic title="Passing" value={summary.pass} styles={{ content: { color: '#2f7d4f' } }} />
        </Col>
        <Col xs={12} md={5}>
          <Statistic
            title="Failing"
            value={summary.fail}
            styles={{ content: summary.fail > 0 ? { color: '#b42318' } : undefined }}
          />
        </Col>
        <Col xs={12} md={4}>
          <Statistic title="Without a check" value={summary.unchecked} />
        </Col>
        <Col xs={12} md={5}>
          <Statistic title="Load rows" value={preview.loadRowCount} />
        </Col>
      </Row>
      <Typography.Text type="secondary">
        Verdicts against the limit set “{preview.limitSet.name}”.
      </Typography.Text>
      <CautionNote />
    </Flex>
  );
}
