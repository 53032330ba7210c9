import { useEffect, useRef } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { useSWRConfig } from 'swr';
import { setUnauthenticatedHandler } from './fetcher';
import { paths } from './paths';

/**
 * When any call finds the session gone (401), forget every cached answer
 * (they belonged to the session) and go to the sign-in page, which brings
 * the person back here afterwards. Rendered once, inside the router.
 */
export function SessionExpiry() {
  const navigate = useNavigate();
  const location = useLocation();
  const { mutate } = useSWRConfig();
  const here = useRef(location);
  here.current = location;

  useEffect(() => {
    setUnauthenticatedHandler(() => {
      const { pathname, search } = here.current;
      if (pathname === paths.signIn.path) return;
      void mutate(() => true, undefined, { revalidate: false });
      navigate(paths.signIn.getHref({ next: pathname + search }), { replace: true });
    });
  }, [navigate, mutate]);

  return null;
}
