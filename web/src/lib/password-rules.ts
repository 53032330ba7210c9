import type { FormRule } from 'antd';
import { LIMITS } from '@sagline/common/api-types';

/** Rules for choosing a password, from the shared limits (constraints.ts). */
export const newPasswordRules: FormRule[] = [
  { required: true, message: 'Choose a password.' },
  { min: LIMITS.passwordMin, message: `Use at least ${LIMITS.passwordMin} characters.` },
  { max: LIMITS.passwordMax, message: `Use at most ${LIMITS.passwordMax} characters.` },
];

/** The confirmation must repeat the field named `of`. */
export function confirmPasswordRules(of: string): FormRule[] {
  return [
    { required: true, message: 'Type the password again.' },
    ({ getFieldValue }) => ({
      validator: (_rule, value: string | undefined) =>
        !value || getFieldValue(of) === value
          ? Promise.resolve()
          : Promise.reject(new Error('The two passwords are not the same.')),
    }),
  ];
}
