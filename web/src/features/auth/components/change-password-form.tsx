import { useState } from 'react';
import { Alert, Button, Form, Input } from 'antd';
import { LIMITS } from '@sagline/common/api-types';
import { errorMessage } from '@/app/api-error';
import { showFieldErrors } from '@/lib/form-errors';
import { newPasswordRules, confirmPasswordRules } from '@/lib/password-rules';
import { useChangePassword } from '../api/change-password';

interface Values {
  currentPassword: string;
  newPassword: string;
  confirm: string;
}

export function ChangePasswordForm() {
  const [form] = Form.useForm<Values>();
  const { trigger, isMutating } = useChangePassword();
  const [outcome, setOutcome] = useState<{ ok: true } | { ok: false; message: string } | null>(null);

  const submit = async (values: Values) => {
    setOutcome(null);
    try {
      await trigger({ currentPassword: values.currentPassword, newPassword: values.newPassword });
      form.resetFields();
      setOutcome({ ok: true });
    } catch (e) {
      if (!showFieldErrors(form, e, ['currentPassword', 'newPassword'])) {
        setOutcome({ ok: false, message: errorMessage(e) });
      }
    }
  };

  return (
    <Form form={form} layout="vertical" requiredMark={false} onFinish={submit} disabled={isMutating} style={{ maxWidth: 420 }}>
      <Form.Item
        label="Current password"
        name="currentPassword"
        rules={[
          { required: true, message: 'Enter your current password.' },
          { max: LIMITS.passwordMax, message: `A password has at most ${LIMITS.passwordMax} characters.` },
        ]}
      >
        <Input.Password autoComplete="current-password" />
      </Form.Item>
      <Form.Item label="New password" name="newPassword" rules={newPasswordRules} extra={`At least ${LIMITS.passwordMin} characters.`}>
        <Input.Password autoComplete="new-password" />
      </Form.Item>
      <Form.Item label="Confirm new password" name="confirm" dependencies={['newPassword']} rules={confirmPasswordRules('newPassword')}>
        <Input.Password autoComplete="new-password" />
      </Form.Item>
      {outcome && (
        <Form.Item>
          {outcome.ok ? (
            <Alert type="success" showIcon title="Password changed. Use the new one next time you sign in." />
          ) : (
            <Alert type="error" showIcon title={outcome.message} />
          )}
        </Form.Item>
      )}
      <Form.Item style={{ marginBottom: 0 }}>
        <Button type="primary" htmlType="submit" loading={isMutating}>
          Change password
        </Button>
      </Form.Item>
    </Form>
  );
}
