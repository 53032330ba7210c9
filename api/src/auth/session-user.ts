import type { Me } from '@sagline/common/api-types';

// The signed-in person on `req.user` is the client-facing account (no hash).
declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends Me {}
  }
}

export type SessionUser = Me;
