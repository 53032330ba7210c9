import { DownloadOutlined } from '@ant-design/icons';
import { Button, type ButtonProps } from 'antd';
import { flagsWorkbookHref } from '../api/export-urls';

/**
 * "Flags workbook" download button: every flag of the project as xlsx
 * (status, overdue, assignee, due, last comment …). Any member may use it;
 * drop it into any screen of the project.
 */
export function FlagsWorkbookLink({ projectId, size = 'middle', type = 'default' }: { projectId: number | string; size?: ButtonProps['size']; type?: ButtonProps['type'] }) {
  return (
    <Button href={flagsWorkbookHref(projectId)} download icon={<DownloadOutlined />} size={size} type={type}>
      Flags workbook
    </Button>
  );
}
