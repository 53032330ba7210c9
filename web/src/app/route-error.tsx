import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Button, Result } from 'antd';
import { MissingSupport } from '@/components/missing-support';
import { paths } from './paths';

/**
 * What a route shows when its module failed to load or its page threw while
 * rendering. A failed chunk after a new release is the usual cause of the
 * first, so say so.
 */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) return <NotFoundResult />;
  const message = error instanceof Error ? error.message : String(error ?? '');
  const chunk = /dynamically imported module|Loading chunk|Importing a module script failed/i.test(message);
  return (
    <Result
      status="error"
      title={chunk ? 'This screen could not be loaded' : 'This screen stopped with an error'}
      subTitle={
        chunk
          ? 'Sagline may have been updated since this page was opened. Reload to get the current version.'
          : `${message || 'An unexpected error occurred.'} Reload the page; if it happens again, tell your administrator what you were doing.`
      }
      extra={[
        <Button key="reload" type="primary" onClick={() => window.location.reload()}>
          Reload
        </Button>,
        <Link key="projects" to={paths.projects.getHref()}>
          <Button>Projects</Button>
        </Link>,
      ]}
    />
  );
}

export function NotFoundResult() {
  return (
    <Result
      icon={<MissingSupport />}
      title="Page not found"
      subTitle="There is no screen at this address. It may have moved, or the link is incomplete."
      extra={
        <Link to={paths.projects.getHref()}>
          <Button type="primary">Go to projects</Button>
        </Link>
      }
    />
  );
}
