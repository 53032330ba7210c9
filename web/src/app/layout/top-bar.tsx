import { Link, useNavigate } from 'react-router-dom';
import { App, Avatar, Button, Dropdown, Flex, Typography } from 'antd';
import type { MenuProps } from 'antd';
import { useMailboxAvailable } from '@/features/mailbox/api/get-mailbox';
import { useSignOut } from '@/features/auth/api/sign-out';
import { SaglineMark } from '@/components/sagline-mark';
import { useOptionalUser } from '@/lib/current-user';
import { errorMessage } from '../api-error';
import { paths } from '../paths';

function initials(name: string, email: string): string {
  const words = (name || email).split(/[\s@._-]+/).filter(Boolean);
  return ((words[0]?.[0] ?? '') + (words[1]?.[0] ?? '')).toUpperCase() || '?';
}

export function TopBar() {
  const me = useOptionalUser();
  const navigate = useNavigate();
  const signOut = useSignOut();
  const mailbox = useMailboxAvailable();
  const { message } = App.useApp();

  const items: MenuProps['items'] = [
    { key: 'account', label: <Link to={paths.account.getHref()}>Account</Link> },
    ...(mailbox ? [{ key: 'mailbox', label: <Link to={paths.mailbox.getHref()}>Mailbox (development)</Link> }] : []),
    { type: 'divider' as const },
    {
      key: 'sign-out',
      label: 'Sign out',
      onClick: async () => {
        try {
          await signOut();
        } catch (e) {
          void message.error(errorMessage(e));
        }
        navigate(paths.signIn.getHref(), { replace: true });
      },
    },
  ];

  return (
    <Flex align="center" justify="space-between" style={{ height: '100%' }} gap={16}>
      <Flex align="center" gap={28} style={{ minWidth: 0 }}>
        <Link
          to={me ? paths.projects.getHref() : paths.signIn.getHref()}
          style={{ display: 'flex', alignItems: 'center', gap: 10, color: '#fff' }}
          aria-label="Sagline, to projects"
        >
          <SaglineMark size={28} />
          <span style={{ fontSize: 18, fontWeight: 600, letterSpacing: 0.2 }}>Sagline</span>
        </Link>
        {me && (
          <Link to={paths.projects.getHref()} style={{ color: '#d3dee3', fontWeight: 500 }}>
            Projects
          </Link>
        )}
      </Flex>
      {me ? (
        <Dropdown menu={{ items }} trigger={['click']} placement="bottomRight">
          <Button type="text" aria-label={`Account menu for ${me.name || me.email}`} style={{ color: '#fff', height: 40 }}>
            <Flex align="center" gap={8}>
              <Avatar size={28} style={{ background: '#3f8f96', fontSize: 12 }}>
                {initials(me.name, me.email)}
              </Avatar>
              <Typography.Text style={{ color: '#fff', maxWidth: 220 }} ellipsis>
                {me.name || me.email}
              </Typography.Text>
            </Flex>
          </Button>
        </Dropdown>
      ) : (
        <Flex gap={16} align="center">
          {mailbox && (
            <Link to={paths.mailbox.getHref()} style={{ color: '#d3dee3' }}>
              Mailbox
            </Link>
          )}
          <Link to={paths.signIn.getHref()} style={{ color: '#fff', fontWeight: 500 }}>
            Sign in
          </Link>
        </Flex>
      )}
    </Flex>
  );
}
