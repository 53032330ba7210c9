import { Link, Outlet, useLocation, useParams } from 'react-router-dom';
import { Button, Card, Flex, Result } from 'antd';
import { isApiError } from '@/app/api-error';
import { paths } from '@/app/paths';
import { LoadError } from '@/components/load-error';
import { MissingSupport } from '@/components/missing-support';
import { PageLoading } from '@/components/page-loading';
import { RegionBoundary } from '@/components/region-boundary';
import { CurrentProjectProvider } from '@/lib/current-project';
import { useProject } from '../api/get-project';
import { ProjectHeader } from '../components/project-header';
import { ProjectNav } from '../components/project-nav';

/** Header and section navigation around every screen of one project. */
export function ProjectShellPage() {
  const { projectId = '' } = useParams();
  const { pathname } = useLocation();
  const { data: project, error, isLoading, mutate } = useProject(projectId);

  if (isLoading) return <PageLoading label="Opening the project…" />;
  if (error) {
    if (isApiError(error) && error.statusCode === 404) {
      return (
        <Card>
          <Result
            icon={<MissingSupport />}
            title="Project not found"
            subTitle="This project does not exist, or you are not on its team. Ask its manager for an invitation."
            extra={
              <Link to={paths.projects.getHref()}>
                <Button type="primary">Back to projects</Button>
              </Link>
            }
          />
        </Card>
      );
    }
    return <LoadError error={error} what="this project" onRetry={() => void mutate()} />;
  }
  if (!project) return null;

  return (
    <CurrentProjectProvider project={project}>
      <Flex vertical gap={12}>
        <ProjectHeader project={project} />
        <ProjectNav projectId={project.id} />
        <RegionBoundary region="this screen" resetKey={pathname}>
          <Outlet />
        </RegionBoundary>
      </Flex>
    </CurrentProjectProvider>
  );
}
