import { useState } from 'react';
import { Alert, Button, Flex, Form, Input, Modal, Typography } from 'antd';
import { FlagOutlined } from '@ant-design/icons';
import {
  FLAG_LIMITS,
  type BulkFlagMemberFilter,
  type BulkRaiseFlagsRequest,
  type BulkRaiseFlagsResponse,
  type MemberListQuery,
} from '@sagline/common/api-types';
import { errorMessage } from '@/app/api-error';
import { useCurrentProject } from '@/lib/current-project';
import { showFieldErrors } from '@/lib/form-errors';
import { can } from '@/lib/roles';
import { bulkRaiseFlags } from '../api/bulk-raise-flags';
import { useRevalidateFlags } from '../api/revalidate-flags';
import { todayUtc } from './due-date';
import { EngineerSelect } from './engineer-select';

interface BulkValues {
  comment: string;
  assigneeId: number | null;
  dueDate: string;
}

/**
 * The Members filter as the bulk route reads it (BulkFlagMemberFilter): the
 * verdict is always "fail", revision, sort and paging do not apply.
 */
export function bulkFilterOf(query: MemberListQuery): BulkFlagMemberFilter {
  const f: BulkFlagMemberFilter = {};
  const text = (v: string | string[] | undefined) => (Array.isArray(v) ? (v.length ? v : undefined) : v || undefined);
  const q = query as MemberListQuery & { check?: string | string[] };
  if (text(q.level)) f.level = q.level;
  if (text(q.category)) f.category = q.category;
  if (text(q.material)) f.material = q.material;
  if (text(q.reviewer)) f.reviewer = q.reviewer;
  if (text(q.check)) f.check = q.check;
  if (q.utilMin !== undefined && q.utilMin !== null && !Number.isNaN(Number(q.utilMin))) f.utilMin = Number(q.utilMin);
  if (q.utilMax !== undefined && q.utilMax !== null && !Number.isNaN(Number(q.utilMax))) f.utilMax = Number(q.utilMax);
  if (q.q?.trim()) f.q = q.q.trim();
  return f;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * "Raise flags for every failing member of the current filter" (checkers
 * only): asks to confirm, with an optional comment, assignee and due date,
 * then says how many were raised and how many skipped (already flagged).
 */
export function BulkRaiseButton({
  projectId,
  query,
  failingCount,
}: {
  projectId: number;
  query: MemberListQuery;
  failingCount: number;
}) {
  const project = useCurrentProject();
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [result, setResult] = useState<BulkRaiseFlagsResponse | null>(null);
  const [form] = Form.useForm<BulkValues>();
  const revalidate = useRevalidateFlags(projectId);

  if (!can.raiseFlags(project.myRole)) return null;

  const tooMany = failingCount > FLAG_LIMITS.bulkMax;
  const none = failingCount === 0;

  const close = () => {
    setOpen(false);
    setProblem(null);
    setResult(null);
    form.resetFields();
  };

  const submit = async (v: BulkValues) => {
    setProblem(null);
    setBusy(true);
    const body: BulkRaiseFlagsRequest = { filter: bulkFilterOf(query) };
    if (v.comment?.trim()) body.comment = v.comment.trim();
    if (v.assigneeId) body.assigneeId = v.assigneeId;
    if (v.dueDate) body.dueDate = v.dueDate;
    try {
      setResult(await bulkRaiseFlags(projectId, body));
      void revalidate();
    } catch (e) {
      if (!showFieldErrors(form, e, ['comment', 'assigneeId', 'dueDate'])) setProblem(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <>
      <Button
        icon={<FlagOutlined />}
        disabled={none}
        title={none ? 'No failing member in this filter.' : undefined}
        onClick={() => setOpen(true)}
      >
        Raise flags for {plural(failingCount, 'failing member')}
      </Button>
      <Modal open={open} title="Raise flags for the failing members of this filter" footer={null} onCancel={close} destroyOnHidden>
        {result ? (
          <Flex vertical gap={12}>
            <Alert
              type={result.created.length ? 'success' : 'info'}
              showIcon
              title={`${plural(result.created.length, 'flag')} raised; ${plural(result.skipped, 'member')} skipped.`}
              description={
                result.skipped > 0
                  ? `Skipped because they already have an open or answered flag: ${result.skippedMarks.join(', ')}.`
                  : undefined
              }
            />
            <Flex justify="end">
              <Button type="primary" onClick={close}>
                Done
              </Button>
            </Flex>
          </Flex>
        ) : (
          <Form<BulkValues>
            form={form}
            layout="vertical"
            requiredMark={false}
            aria-label="Raise flags in bulk"
            initialValues={{ comment: '', assigneeId: null, dueDate: '' }}
            onFinish={submit}
            disabled={busy}
          >
            <Typography.Paragraph>
              One flag on each of the {plural(failingCount, 'failing member')} of the current filter, on the member as a
              whole. Members that already have an open or answered flag are skipped.
            </Typography.Paragraph>
            {tooMany && (
              <Alert
                type="warning"
                showIcon
                style={{ marginBottom: 12 }}
                title={`At most ${FLAG_LIMITS.bulkMax} members at once`}
                description="Narrow the filter (by level, category or check) and raise them in parts."
              />
            )}
            <Form.Item
              label="Comment (optional)"
              name="comment"
              rules={[{ max: FLAG_LIMITS.bodyMax, message: `A comment has at most ${FLAG_LIMITS.bodyMax} characters.` }]}
            >
              <Input.TextArea rows={3} placeholder="The same comment goes on every flag." />
            </Form.Item>
            <Flex gap={12} wrap>
              <Form.Item label="Assignee" name="assigneeId" style={{ flex: '1 1 200px' }}>
                <EngineerSelect projectId={projectId} aria-label="Assignee" />
              </Form.Item>
              <Form.Item
                label="Due date (optional)"
                name="dueDate"
                style={{ flex: '1 1 160px' }}
                rules={[
                  {
                    validator: (_r, value: string) =>
                      !value || value >= todayUtc() ? Promise.resolve() : Promise.reject(new Error('Choose today or a later date.')),
                  },
                ]}
              >
                <Input type="date" aria-label="Due date" />
              </Form.Item>
            </Flex>
            {problem && <Alert type="error" showIcon title={problem} style={{ marginBottom: 12 }} />}
            <Flex gap={8} justify="end">
              <Button onClick={close}>Cancel</Button>
              <Button type="primary" htmlType="submit" loading={busy} disabled={tooMany || none}>
                Raise {plural(failingCount, 'flag')}
              </Button>
            </Flex>
          </Form>
        )}
      </Modal>
    </>
  );
}
