import { Button, Space } from 'antd';
import { exampleHref, templateHref } from '../api/import-urls';

/** The blank member schedule and the same with a few example members, in the project's units. */
export function TemplateDownloads({ projectId }: { projectId: number | string }) {
  return (
    <Space wrap>
      <Button href={templateHref(projectId)} download>
        Download blank template
      </Button>
      <Button href={exampleHref(projectId)} download>
        Download example
      </Button>
    </Space>
  );
}
