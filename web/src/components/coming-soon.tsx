import { Card, Typography } from 'antd';

/**
 * An honest placeholder for a screen that is not built yet: what it will do,
 * in plain words, and no pretend controls.
 */
export function ComingSoon({ title, summary, points }: { title: string; summary: string; points: string[] }) {
  return (
    <Card>
      <Typography.Title level={3} style={{ marginTop: 0 }}>
        {title}
      </Typography.Title>
      <Typography.Paragraph type="secondary" style={{ marginBottom: 8 }}>
        Not built yet. Coming here:
      </Typography.Paragraph>
      <Typography.Paragraph>{summary}</Typography.Paragraph>
      <ul style={{ margin: 0, paddingInlineStart: 20 }}>
        {points.map((p) => (
          <li key={p}>
            <Typography.Text>{p}</Typography.Text>
          </li>
        ))}
      </ul>
    </Card>
  );
}
