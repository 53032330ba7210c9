import { useState } from 'react';
import { Alert, Button, Flex, Form, Input, Select } from 'antd';
import { FLAG_LIMITS, type FlagDetail, type RaiseFlagRequest } from '@sagline/common/api-types';
import { errorMessage, isApiError } from '@/app/api-error';
import { showFieldErrors } from '@/lib/form-errors';
import { raiseFlag } from '../api/raise-flag';
import { useRevalidateFlags } from '../api/revalidate-flags';
import { todayUtc } from './due-date';
import { EngineerSelect } from './engineer-select';

interface RaiseValues {
  checkName: string;
  title: string;
  comment: string;
  assigneeId: number | null;
  dueDate: string;
}

/** "" in the check select: the member as a whole. */
const WHOLE_MEMBER = '';

/**
 * A checker raises a flag on one member: optionally on one of its checks,
 * with a comment, an engineer to answer it and a due date.
 */
export function RaiseFlagForm({
  projectId,
  mark,
  checks,
  onRaised,
  onCancel,
}: {
  projectId: number;
  mark: string;
  checks: string[];
  onRaised: (flag: FlagDetail) => void;
  onCancel: () => void;
}) {
  const [form] = Form.useForm<RaiseValues>();
  const revalidate = useRevalidateFlags(projectId);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  const submit = async (v: RaiseValues) => {
    setProblem(null);
    setBusy(true);
    const body: RaiseFlagRequest = { mark };
    if (v.checkName) body.checkName = v.checkName;
    if (v.title?.trim()) body.title = v.title.trim();
    if (v.comment?.trim()) body.comment = v.comment.trim();
    if (v.assigneeId) body.assigneeId = v.assigneeId;
    if (v.dueDate) body.dueDate = v.dueDate;
    try {
      const flag = await raiseFlag(projectId, body);
      void revalidate();
      form.resetFields();
      onRaised(flag);
    } catch (e) {
      if (isApiError(e) && e.code === 'CONFLICT') setProblem(e.message);
      else if (!showFieldErrors(form, e, ['checkName', 'title', 'comment', 'assigneeId', 'dueDate'])) setProblem(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <Form<RaiseValues>
      form={form}
      layout="vertical"
      requiredMark={false}
      aria-label={`Raise a flag on ${mark}`}
      initialValues={{ checkName: WHOLE_MEMBER, title: '', comment: '', assigneeId: null, dueDate: '' }}
      onFinish={submit}
      disabled={busy}
    >
      <Form.Item label="Check" name="checkName" extra="Leave it on the member as a whole, or choose the check that fails.">
        <Select
          aria-label="Check"
          options={[
            { value: WHOLE_MEMBER, label: 'The member as a whole' },
            ...checks.map((c) => ({ value: c, label: c })),
          ]}
        />
      </Form.Item>
      <Form.Item
        label="Title (optional)"
        name="title"
        rules={[{ max: FLAG_LIMITS.titleMax, message: `A title has at most ${FLAG_LIMITS.titleMax} characters.` }]}
      >
        <Input placeholder={`Left empty: “${mark} fails <check> (utilisation …)”`} />
      </Form.Item>
      <Form.Item
        label="Comment"
        name="comment"
        rules={[
          { whitespace: true, message: 'Write a comment, or leave it empty.' },
          { max: FLAG_LIMITS.bodyMax, message: `A comment has at most ${FLAG_LIMITS.bodyMax} characters.` },
        ]}
      >
        <Input.TextArea rows={3} placeholder="What should the engineer look at?" />
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
                !value || value >= todayUtc()
                  ? Promise.resolve()
                  : Promise.reject(new Error('Choose today or a later date.')),
            },
          ]}
        >
          <Input type="date" aria-label="Due date" />
        </Form.Item>
      </Flex>
      {problem && <Alert type="error" showIcon title={problem} style={{ marginBottom: 12 }} />}
      <Flex gap={8} justify="end">
        <Button onClick={onCancel}>Cancel</Button>
        <Button type="primary" htmlType="submit" loading={busy}>
          Raise flag
        </Button>
      </Flex>
    </Form>
  );
}
