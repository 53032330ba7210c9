/** A row of `users` as the repositories return it. */
export interface UserRow {
  id: number;
  email: string;
  name: string;
  password_hash: string | null;
  is_admin: boolean;
  digest: 'off' | 'daily' | 'weekly';
  created_at: Date;
  updated_at: Date;
}
