import { Outlet, ScrollRestoration, useNavigation } from 'react-router-dom';
import { SessionExpiry } from './session-expiry';

/**
 * Above every layout: a thin bar while a lazy screen module is on its way
 * (the data router waits for it before switching), scroll restoration, and
 * the 401 handling of every API call.
 */
export function RootFrame() {
  const navigation = useNavigation();
  return (
    <>
      {navigation.state !== 'idle' && <div className="sg-route-progress" role="progressbar" aria-label="Loading screen" />}
      <SessionExpiry />
      <Outlet />
      <ScrollRestoration />
    </>
  );
}
