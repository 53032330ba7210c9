import { App, Flex, Skeleton, Switch, Typography } from 'antd';
import { errorMessage } from '@/app/api-error';
import { LoadError } from '@/components/load-error';
import { usePreferences } from '../api/get-preferences';
import { useUpdatePreferences } from '../api/update-preferences';

/** The daily digest e-mail, on or off. */
export function DigestSwitch() {
  const { message } = App.useApp();
  const { data, error, mutate } = usePreferences();
  const update = useUpdatePreferences();

  if (error) return <LoadError error={error} what="your e-mail preferences" onRetry={() => void mutate()} />;
  if (!data) return <Skeleton active paragraph={{ rows: 1 }} title={false} />;

  const onChange = async (digest: boolean) => {
    try {
      await update.trigger({ digest });
      void message.success(digest ? 'You will get the daily digest.' : 'The daily digest is off; you still get e-mails about your own flags.');
    } catch (e) {
      void message.error(errorMessage(e));
    }
  };

  return (
    <Flex gap={12} align="flex-start">
      <Switch id="digest-switch" checked={data.digest} loading={update.isMutating} onChange={(on) => void onChange(on)} aria-describedby="digest-help" />
      <Flex vertical gap={2}>
        <label htmlFor="digest-switch" style={{ fontWeight: 500, cursor: 'pointer' }}>
          Daily digest
        </label>
        <Typography.Text id="digest-help" type="secondary" style={{ fontSize: 13 }}>
          One e-mail a day listing what waits on you across your projects: open flags assigned to you, answers waiting for you to close and, in projects you manage, overdue flags; overdue first. Nothing is sent on a day when nothing waits. E-mails about a single flag (assigned, answered, closed, reopened) come either way.
        </Typography.Text>
      </Flex>
    </Flex>
  );
}
