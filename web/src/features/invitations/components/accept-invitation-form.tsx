import { useState } from 'react';
import { Form, Input } from 'antd';
import { LIMITS, type InvitationResponse } from '@sagline/common/api-types';
import { errorMessage, isApiError } from '@/app/api-error';
import { FormFooter } from '@/components/form-footer';
import { NewPasswordFields } from '@/components/password-fields';
import { showFieldErrors } from '@/lib/form-errors';
import { useAcceptInvitation } from '../api/accept-invitation';

interface Values {
  name: string;
  password: string;
  confirm: string;
}

export function AcceptInvitationForm({
  token,
  invitation,
  onAccepted,
  onGone,
}: {
  token: string;
  invitation: InvitationResponse;
  onAccepted: () => void;
  /** The link expired or was used between opening and sending. */
  onGone: (error: unknown) => void;
}) {
  const [form] = Form.useForm<Values>();
  const { trigger, isMutating } = useAcceptInvitation(token);
  const [problem, setProblem] = useState<string | null>(null);

  const submit = async (values: Values) => {
    setProblem(null);
    try {
      await trigger({ name: values.name.trim(), password: values.password });
      onAccepted();
    } catch (e) {
      if (isApiError(e) && (e.statusCode === 404 || e.statusCode === 410)) return onGone(e);
      if (!showFieldErrors(form, e, ['name', 'password'])) setProblem(errorMessage(e));
    }
  };

  return (
    <Form
      form={form}
      layout="vertical"
      requiredMark={false}
      initialValues={{ name: invitation.name ?? '' }}
      onFinish={submit}
      disabled={isMutating}
    >
      <Form.Item label="E-mail">
        <Input value={invitation.email} disabled autoComplete="username" />
      </Form.Item>
      <Form.Item
        label="Your name"
        name="name"
        rules={[
          { required: true, whitespace: true, message: 'Enter your name as colleagues should see it.' },
          { max: LIMITS.nameMax, message: `A name has at most ${LIMITS.nameMax} characters.` },
        ]}
      >
        <Input autoComplete="name" />
      </Form.Item>
      <NewPasswordFields name="password" label="Password" confirmLabel="Confirm password" />
      <FormFooter problem={problem} submitLabel="Set password" loading={isMutating} block />
    </Form>
  );
}
