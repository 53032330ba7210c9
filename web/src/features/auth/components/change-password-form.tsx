import { useState } from 'react';
import { Form } from 'antd';
import { errorMessage } from '@/app/api-error';
import { FormFooter } from '@/components/form-footer';
import { CurrentPasswordField, NewPasswordFields } from '@/components/password-fields';
import { showFieldErrors } from '@/lib/form-errors';
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
      <CurrentPasswordField name="currentPassword" label="Current password" requiredMessage="Enter your current password." />
      <NewPasswordFields name="newPassword" label="New password" confirmLabel="Confirm new password" />
      <FormFooter
        problem={outcome && !outcome.ok ? outcome.message : null}
        done={outcome?.ok ? 'Password changed. Use the new one next time you sign in.' : null}
        submitLabel="Change password"
        loading={isMutating}
      />
    </Form>
  );
}
