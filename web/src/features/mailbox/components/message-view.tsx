import { Descriptions, Flex, Tabs, Typography } from 'antd';
import type { MailboxMessage } from '@sagline/common/api-types';
import { formatDateTime } from '@/lib/format';
import { HtmlMessage } from './html-message';
import { LinkifiedText } from './linkified-text';

export function MessageView({ message }: { message: MailboxMessage }) {
  const text = <LinkifiedText text={message.text || '(this message has no text part)'} />;
  return (
    <Flex vertical gap={12}>
      <Typography.Title level={4} style={{ margin: 0 }}>
        {message.subject || '(no subject)'}
      </Typography.Title>
      <Descriptions size="small" column={1} styles={{ label: { width: 64 } }}>
        <Descriptions.Item label="From">{message.from}</Descriptions.Item>
        <Descriptions.Item label="To">{message.to.join(', ')}</Descriptions.Item>
        <Descriptions.Item label="Sent">{formatDateTime(message.receivedAt)}</Descriptions.Item>
      </Descriptions>
      {message.html ? (
        <Tabs
          size="small"
          items={[
            { key: 'text', label: 'Text', children: text },
            { key: 'html', label: 'HTML', children: <HtmlMessage html={message.html} title={message.subject} /> },
          ]}
        />
      ) : (
        text
      )}
    </Flex>
  );
}
