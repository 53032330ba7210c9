import { useEffect, useState } from 'react';
import { Button, Flex, Progress, Typography, Upload } from 'antd';
import { IMPORT_LIMITS } from '@sagline/common/api-types';
import { fileSizeText } from './file-size';

export interface UploadInProgress {
  fileName: string;
  fileSize: number;
  startedAt: number;
}

/**
 * Drop zone for a schedule file (.xlsx or .csv). The file goes to `onFile`;
 * antd's own upload list and request are not used (the page posts through
 * the app's fetcher). While a file is on its way the zone gives way to a
 * progress bar: fetch reports no upload bytes, so the bar runs without a
 * percentage and the seconds count up, until the report arrives.
 */
export function ScheduleUpload({
  uploading,
  onFile,
  onCancel,
}: {
  uploading: UploadInProgress | null;
  onFile: (file: File) => void;
  onCancel: () => void;
}) {
  if (uploading) return <UploadProgress uploading={uploading} onCancel={onCancel} />;
  return (
    <Upload.Dragger
      accept=".xlsx,.csv"
      multiple={false}
      showUploadList={false}
      beforeUpload={(file) => {
        onFile(file);
        return Upload.LIST_IGNORE;
      }}
      aria-label="Upload a member schedule"
    >
      <Flex vertical gap={4} style={{ padding: '8px 16px' }}>
        <Typography.Text strong>Drop the member schedule here, or click to choose it</Typography.Text>
        <Typography.Text type="secondary">
          An .xlsx workbook with the Members and Loads sheets of the template, or a .csv of the Members sheet; at most{' '}
          {fileSizeText(IMPORT_LIMITS.maxFileBytes)}. Every row is checked before anything is stored.
        </Typography.Text>
      </Flex>
    </Upload.Dragger>
  );
}

function UploadProgress({ uploading, onCancel }: { uploading: UploadInProgress; onCancel: () => void }) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, []);
  const seconds = Math.max(0, Math.floor((now - uploading.startedAt) / 1000));
  return (
    <Flex vertical gap={8} role="status" aria-live="polite" style={{ padding: '16px 4px' }}>
      <Typography.Text>
        Uploading <Typography.Text strong>{uploading.fileName}</Typography.Text> ({fileSizeText(uploading.fileSize)}) and
        checking every row…
      </Typography.Text>
      <Progress percent={100} status="active" showInfo={false} aria-label="Upload in progress" />
      <Flex justify="space-between" align="center">
        <Typography.Text type="secondary">{seconds > 0 ? `${seconds} s` : 'Starting'}</Typography.Text>
        <Button size="small" onClick={onCancel}>
          Cancel
        </Button>
      </Flex>
    </Flex>
  );
}
