import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { Flex, Result } from 'antd';
import { useMe } from '@/features/auth/api/get-me';
import { LoadError } from '@/components/load-error';
import { PageLoading } from '@/components/page-loading';
import { CurrentUserProvider } from '@/lib/current-user';
import { isApiError } from './api-error';
import { paths } from './paths';

/**
 * Lets signed-in people through and sends everyone else to the sign-in page
 * with a return path. Uses GET /api/auth/me, whose 401 is an answer here.
 */
export function RequireAuth({ children }: { children: ReactNode }) {
  const { data, error, mutate } = useMe();
  const location = useLocation();

  if (isApiError(error) && error.statusCode === 401) {
    return <Navigate to={paths.signIn.getHref({ next: location.pathname + location.search })} replace />;
  }
  if (!data && error) {
    return (
      <Flex justify="center" style={{ padding: 48 }}>
        <Result status="warning" title="Sagline cannot check who you are right now">
          <LoadError error={error} what="your account" onRetry={() => void mutate()} />
        </Result>
      </Flex>
    );
  }
  if (!data) return <PageLoading label="Checking your sign-in…" />;
  return <CurrentUserProvider user={data.user}>{children}</CurrentUserProvider>;
}

/** For pages that work signed in or not (the mailbox, 404): provides the person when there is one. */
export function OptionalAuth({ children }: { children: ReactNode }) {
  const { data } = useMe();
  return <CurrentUserProvider user={data?.user ?? null}>{children}</CurrentUserProvider>;
}
