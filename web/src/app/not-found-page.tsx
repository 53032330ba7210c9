import { Card } from 'antd';
import { NotFoundResult } from './route-error';

export function NotFoundPage() {
  return (
    <Card>
      <NotFoundResult />
    </Card>
  );
}
