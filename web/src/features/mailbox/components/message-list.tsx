import { Typography } from 'antd';
import type { MailboxMessage } from '@sagline/common/api-types';
import { formatDateTime } from '@/lib/format';

export function MessageList({
  messages,
  selectedId,
  onSelect,
}: {
  messages: MailboxMessage[];
  selectedId?: string;
  onSelect: (id: string) => void;
}) {
  return (
    <ul aria-label="Messages" style={{ listStyle: 'none', margin: 0, padding: 0 }}>
      {messages.map((m) => {
        const selected = m.id === selectedId;
        return (
          <li key={m.id} style={{ borderBottom: '1px solid #eef1f3' }}>
            <a
              href={`?id=${encodeURIComponent(m.id)}`}
              onClick={(e) => {
                e.preventDefault();
                onSelect(m.id);
              }}
              aria-current={selected ? 'true' : undefined}
              style={{
                display: 'block',
                padding: '10px 16px 10px 13px',
                color: 'inherit',
                background: selected ? '#e8f1f1' : undefined,
                borderInlineStart: `3px solid ${selected ? '#1f6b72' : 'transparent'}`,
              }}
            >
              <Typography.Text strong ellipsis style={{ display: 'block' }}>
                {m.subject || '(no subject)'}
              </Typography.Text>
              <span style={{ display: 'flex', justifyContent: 'space-between', gap: 8 }}>
                <Typography.Text type="secondary" ellipsis style={{ fontSize: 13, minWidth: 0 }}>
                  to {m.to.join(', ')}
                </Typography.Text>
                <Typography.Text type="secondary" style={{ fontSize: 12, whiteSpace: 'nowrap' }}>
                  {formatDateTime(m.receivedAt)}
                </Typography.Text>
              </span>
            </a>
          </li>
        );
      })}
    </ul>
  );
}
