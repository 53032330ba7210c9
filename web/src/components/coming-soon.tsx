import { Card, Flex, Tag, Typography } from 'antd';

/**
 * An honest placeholder for a screen that is not built yet: what it will do,
 * in plain words, and no pretend controls.
 */
export function ComingSoon({ title, summary, points }: { title: string; summary: string; points: string[] }) {
  return (
    <Card>
      <Flex align="center" gap={12} style={{ marginBottom: 12 }}>
        <Typography.Title level={3} style={{ margin: 0 }}>
          {title}
        </Typography.Title>
        <Tag>Not built yet</Tag>
      </Flex>
      <Typography.Paragraph style={{ maxWidth: 720 }}>{summary}</Typography.Paragraph>
      <Typography.Text type="secondary">What will be here:</Typography.Text>
      <ul style={{ margin: '6px 0 0', paddingInlineStart: 20, maxWidth: 720 }}>
        {points.map((p) => (
          <li key={p} style={{ marginBottom: 4 }}>
            <Typography.Text>{p}</Typography.Text>
          </li>
        ))}
      </ul>
    </Card>
  );
}
