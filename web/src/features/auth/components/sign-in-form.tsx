import { useState } from 'react';
import { Form, Input } from 'antd';
import { LIMITS, type SignInRequest } from '@sagline/common/api-types';
import { errorMessage, isApiError } from '@/app/api-error';
import { FormFooter } from '@/components/form-footer';
import { CurrentPasswordField } from '@/components/password-fields';
import { minutesText } from '@/lib/format';
import { useSignIn } from '../api/sign-in';

/**
 * What to tell a person whose sign-in was refused. The server's message says
 * what happened; for a rate limit it should say how long to wait, and when it
 * does not, the Retry-After header does.
 */
export function signInProblem(error: unknown): string {
  if (isApiError(error) && error.code === 'RATE_LIMITED' && error.retryAfterSeconds !== undefined && !/\d/.test(error.message)) {
    return `${error.message} Try again in ${minutesText(error.retryAfterSeconds)}.`;
  }
  return errorMessage(error);
}

export function SignInForm({ initialEmail, onSignedIn }: { initialEmail?: string; onSignedIn: () => void }) {
  const [form] = Form.useForm<SignInRequest>();
  const { trigger, isMutating } = useSignIn();
  const [problem, setProblem] = useState<string | null>(null);

  const submit = async (values: SignInRequest) => {
    setProblem(null);
    try {
      await trigger({ email: values.email.trim(), password: values.password });
      onSignedIn();
    } catch (e) {
      setProblem(signInProblem(e));
    }
  };

  return (
    <Form
      form={form}
      layout="vertical"
      requiredMark={false}
      initialValues={{ email: initialEmail ?? '', password: '' }}
      onFinish={submit}
      onValuesChange={() => problem && setProblem(null)}
      disabled={isMutating}
    >
      <Form.Item
        label="E-mail"
        name="email"
        rules={[
          { required: true, message: 'Enter your e-mail address.' },
          { type: 'email', message: 'This is not an e-mail address (name@example.com).' },
          { max: LIMITS.emailMax, message: `An e-mail address has at most ${LIMITS.emailMax} characters.` },
        ]}
      >
        <Input autoComplete="username" autoFocus={!initialEmail} inputMode="email" />
      </Form.Item>
      <CurrentPasswordField name="password" label="Password" requiredMessage="Enter your password." autoFocus={!!initialEmail} />
      <FormFooter problem={problem} submitLabel="Sign in" loading={isMutating} block />
    </Form>
  );
}
