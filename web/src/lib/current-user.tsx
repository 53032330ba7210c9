import { createContext, useContext, type ReactNode } from 'react';
import type { Me } from '@sagline/common/api-types';

/**
 * The signed-in person, provided by the auth guard (app/require-auth.tsx) so
 * features read it without importing the auth feature.
 */
const CurrentUserContext = createContext<Me | null>(null);

export function CurrentUserProvider({ user, children }: { user: Me | null; children: ReactNode }) {
  return <CurrentUserContext.Provider value={user}>{children}</CurrentUserContext.Provider>;
}

/** The signed-in person; throws outside the guard, where there is none. */
export function useCurrentUser(): Me {
  const user = useContext(CurrentUserContext);
  if (!user) throw new Error('useCurrentUser is used outside a signed-in page');
  return user;
}

/** The signed-in person, or null on pages that work without signing in. */
export function useOptionalUser(): Me | null {
  return useContext(CurrentUserContext);
}
