import { Flex, Spin, Typography } from 'antd';

export function PageLoading({ label = 'Loading…' }: { label?: string }) {
  return (
    <Flex vertical gap={12} align="center" justify="center" style={{ minHeight: 240 }} role="status" aria-live="polite">
      <Spin />
      <Typography.Text type="secondary">{label}</Typography.Text>
    </Flex>
  );
}
