import { Link, useSearchParams } from 'react-router-dom';
import { Alert, Card, Col, Empty, Flex, Row, Typography } from 'antd';
import { isApiError } from '@/app/api-error';
import { paths } from '@/app/paths';
import { LoadError } from '@/components/load-error';
import { PageLoading } from '@/components/page-loading';
import { useMailbox } from '../api/get-mailbox';
import { MessageList } from '../components/message-list';
import { MessageView } from '../components/message-view';

export function MailboxPage() {
  const { data, error, isLoading, mutate } = useMailbox();
  const [params, setParams] = useSearchParams();

  const header = (
    <Flex vertical gap={4}>
      <Typography.Title level={2} style={{ margin: 0 }}>
        Mailbox
      </Typography.Title>
      <Typography.Text type="secondary">
        Development only: every e-mail the app sent, caught by the local mail server instead of being delivered.
      </Typography.Text>
    </Flex>
  );

  if (isLoading) return <PageLoading label="Opening the mailbox…" />;
  if (error) {
    let body = <LoadError error={error} what="the mailbox" onRetry={() => void mutate()} />;
    if (isApiError(error) && error.statusCode === 404) {
      body = (
        <Alert
          type="info"
          showIcon
          title="No mailbox here"
          description="The mailbox exists only in local development, where a fake mail server keeps what the app sends. Here, e-mail goes to real inboxes."
        />
      );
    } else if (isApiError(error) && error.statusCode === 401) {
      body = (
        <Alert
          type="info"
          showIcon
          title="Sign in to read the mailbox"
          description={<Link to={paths.signIn.getHref({ next: paths.mailbox.getHref() })}>Sign in</Link>}
        />
      );
    }
    return (
      <Flex vertical gap={16}>
        {header}
        {body}
      </Flex>
    );
  }

  // Newest first: the message you are waiting for is the one just sent.
  const messages = [...(data ?? [])].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
  const selected = messages.find((m) => m.id === params.get('id')) ?? messages[0];

  return (
    <Flex vertical gap={16}>
      {header}
      {messages.length === 0 ? (
        <Card>
          <Empty image={Empty.PRESENTED_IMAGE_SIMPLE} description="Nothing sent yet. Invitations and notices the app sends appear here within a few seconds." />
        </Card>
      ) : (
        <Row gutter={[16, 16]}>
          <Col xs={24} lg={9}>
            <Card
              size="small"
              title={`${messages.length} message${messages.length === 1 ? '' : 's'}`}
              styles={{ body: { padding: 0, maxHeight: '70vh', overflowY: 'auto' } }}
            >
              <MessageList
                messages={messages}
                selectedId={selected?.id}
                onSelect={(id) => setParams({ id }, { replace: true })}
              />
            </Card>
          </Col>
          <Col xs={24} lg={15}>
            <Card size="small">{selected && <MessageView message={selected} />}</Card>
          </Col>
        </Row>
      )}
    </Flex>
  );
}
