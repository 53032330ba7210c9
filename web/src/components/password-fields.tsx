import { Form, Input } from 'antd';
import { LIMITS } from '@sagline/common/api-types';
import { confirmPasswordRules, newPasswordRules } from '@/lib/password-rules';

/** The password someone has now (signing in, changing it): required, at most the longest password allowed. */
export function CurrentPasswordField({
  name,
  label,
  requiredMessage,
  autoFocus,
}: {
  name: string;
  label: string;
  /** What to say when it is left empty ("Enter your password."). */
  requiredMessage: string;
  autoFocus?: boolean;
}) {
  return (
    <Form.Item
      label={label}
      name={name}
      rules={[
        { required: true, message: requiredMessage },
        { max: LIMITS.passwordMax, message: `A password has at most ${LIMITS.passwordMax} characters.` },
      ]}
    >
      <Input.Password autoComplete="current-password" autoFocus={autoFocus} />
    </Form.Item>
  );
}

/**
 * Choosing a password: the field `name` (rules from the shared limits, the
 * minimum length stated under it) and its confirmation, field `confirm`,
 * which must repeat it.
 */
export function NewPasswordFields({ name, label, confirmLabel }: { name: string; label: string; confirmLabel: string }) {
  return (
    <>
      <Form.Item label={label} name={name} rules={newPasswordRules} extra={`At least ${LIMITS.passwordMin} characters.`}>
        <Input.Password autoComplete="new-password" />
      </Form.Item>
      <Form.Item label={confirmLabel} name="confirm" dependencies={[name]} rules={confirmPasswordRules(name)}>
        <Input.Password autoComplete="new-password" />
      </Form.Item>
    </>
  );
}
