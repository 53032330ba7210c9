import type { Me } from '@sagline/common/api-types';
import type { UserRow } from './users.types';

/** The account as the client sees it: never the hash, never internal columns. */
export function toMe(row: Pick<UserRow, 'id' | 'email' | 'name' | 'is_admin'>): Me {
  return { id: row.id, email: row.email, name: row.name, isAdmin: row.is_admin };
}

/** E-mails are compared and stored trimmed and lower-cased. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}
