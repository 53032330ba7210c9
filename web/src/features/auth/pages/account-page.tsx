import { Card, Descriptions, Flex, Tag, Typography } from 'antd';
import { useCurrentUser } from '@/lib/current-user';
import { ChangePasswordForm } from '../components/change-password-form';
import { DigestSwitch } from '../components/digest-switch';

export function AccountPage() {
  const me = useCurrentUser();
  return (
    <Flex vertical gap={16} style={{ maxWidth: 720 }}>
      <Typography.Title level={2} style={{ margin: 0 }}>
        Account
      </Typography.Title>
      <Card title="You">
        <Descriptions column={1} size="small" styles={{ label: { width: 120 } }}>
          <Descriptions.Item label="Name">{me.name}</Descriptions.Item>
          <Descriptions.Item label="E-mail">{me.email}</Descriptions.Item>
          <Descriptions.Item label="Account">
            {me.isAdmin ? <Tag color="purple">Administrator</Tag> : 'Roles are given per project'}
          </Descriptions.Item>
        </Descriptions>
      </Card>
      <Card title="E-mail">
        <DigestSwitch />
      </Card>
      <Card title="Change password">
        <ChangePasswordForm />
      </Card>
    </Flex>
  );
}
