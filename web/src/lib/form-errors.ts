import type { FormInstance } from 'antd';
import { isApiError } from '@/app/api-error';

/**
 * Puts the API's field-level problems (`details[].path` like `body.email` or
 * `email`) next to the matching form fields. Returns true when at least one
 * detail found its field, so the caller can skip a duplicate banner.
 */
export function showFieldErrors<T extends object>(
  form: FormInstance<T>,
  error: unknown,
  fields: readonly (keyof T & string)[],
): boolean {
  if (!isApiError(error) || error.details.length === 0) return false;
  const byField = new Map<string, string[]>();
  for (const d of error.details) {
    const name = d.path?.replace(/^body\./, '');
    if (!name || !fields.includes(name as keyof T & string)) continue;
    // Details are often fragments after the field path ("is too short").
    const text = d.message.charAt(0).toUpperCase() + d.message.slice(1);
    byField.set(name, [...(byField.get(name) ?? []), text]);
  }
  if (byField.size === 0) return false;
  form.setFields(
    [...byField].map(([name, errors]) => ({ name: name as never, errors })),
  );
  return true;
}
