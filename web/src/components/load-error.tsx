import { Alert, Button } from 'antd';
import { errorMessage } from '@/app/api-error';

/** What a page region shows when its data could not be loaded. */
export function LoadError({ error, what, onRetry }: { error: unknown; what: string; onRetry?: () => void }) {
  return (
    <Alert
      type="error"
      showIcon
      title={`Could not load ${what}`}
      description={errorMessage(error)}
      action={
        onRetry ? (
          <Button size="small" onClick={onRetry}>
            Try again
          </Button>
        ) : undefined
      }
    />
  );
}
