import { useState } from 'react';
import { Alert, Button, Col, Form, Input, Row } from 'antd';
import { LIMITS, type InviteRequest } from '@sagline/common/api-types';
import { errorMessage, isApiError } from '@/app/api-error';
import { showFieldErrors } from '@/lib/form-errors';
import { useInviteMember } from '../api/invite-member';
import { RoleSelect } from './role-select';

export function InviteForm({ projectId }: { projectId: number | string }) {
  const [form] = Form.useForm<InviteRequest>();
  const { trigger, isMutating } = useInviteMember(projectId);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const submit = async (values: InviteRequest) => {
    setProblem(null);
    setSentTo(null);
    const email = values.email.trim();
    const name = values.name?.trim();
    try {
      await trigger({ email, role: values.role, ...(name ? { name } : {}) });
      form.resetFields();
      setSentTo(email);
    } catch (e) {
      if (isApiError(e) && e.code === 'CONFLICT') {
        form.setFields([{ name: 'email', errors: [e.message] }]);
      } else if (!showFieldErrors(form, e, ['email', 'role', 'name'])) {
        setProblem(errorMessage(e));
      }
    }
  };

  return (
    <Form
      form={form}
      layout="vertical"
      requiredMark={false}
      initialValues={{ email: '', name: '', role: 'engineer' }}
      onFinish={submit}
      disabled={isMutating}
      aria-label="Invite someone"
    >
      <Row gutter={12} align="bottom">
        <Col xs={24} md={9}>
          <Form.Item
            style={{ marginBottom: 12 }}
            label="E-mail"
            name="email"
            rules={[
              { required: true, message: 'Enter the e-mail address to send the invitation to.' },
              { type: 'email', message: 'This is not an e-mail address (name@example.com).' },
              { max: LIMITS.emailMax, message: `An e-mail address has at most ${LIMITS.emailMax} characters.` },
            ]}
          >
            <Input placeholder="name@example.com" inputMode="email" />
          </Form.Item>
        </Col>
        <Col xs={24} md={7}>
          <Form.Item
            style={{ marginBottom: 12 }}
            label="Name (optional)"
            name="name"
            rules={[{ max: LIMITS.nameMax, message: `A name has at most ${LIMITS.nameMax} characters.` }]}
          >
            <Input placeholder="They can set it themselves" />
          </Form.Item>
        </Col>
        <Col xs={14} md={5}>
          <Form.Item style={{ marginBottom: 12 }} label="Role" name="role" rules={[{ required: true, message: 'Choose a role.' }]}>
            <RoleSelect aria-label="Role" />
          </Form.Item>
        </Col>
        <Col xs={10} md={3}>
          <Form.Item style={{ marginBottom: 12 }} label=" " colon={false}>
            <Button type="primary" htmlType="submit" loading={isMutating} block>
              Invite
            </Button>
          </Form.Item>
        </Col>
      </Row>
      {sentTo && (
        <Alert
          type="success"
          showIcon
          closable={{ onClose: () => setSentTo(null) }}
          title={`Invitation sent to ${sentTo}.`}
          description={`The link in it is valid for ${LIMITS.invitationHours} hours.`}
        />
      )}
      {problem && <Alert type="error" showIcon title={problem} />}
    </Form>
  );
}
