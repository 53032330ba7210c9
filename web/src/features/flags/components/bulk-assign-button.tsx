import { useState } from 'react';
import { Alert, App, Button, Checkbox, Flex, Form, Input, Modal } from 'antd';
import { UserSwitchOutlined } from '@ant-design/icons';
import type { BulkAssignFlagsRequest } from '@sagline/common/api-types';
import { errorMessage } from '@/app/api-error';
import { showFieldErrors } from '@/lib/form-errors';
import { bulkAssignFlags } from '../api/bulk-assign-flags';
import { useRevalidateFlags } from '../api/revalidate-flags';
import { EngineerSelect } from './engineer-select';

interface AssignValues {
  assigneeId: number | null;
  setDue: boolean;
  dueDate: string;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * Assigns the selected flags to one engineer (or nobody), optionally with a
 * due date (checkers, managers). Closed or waived flags, and flags already so
 * assigned, are skipped and counted by the server.
 */
export function BulkAssignButton({ projectId, flagIds, onDone }: { projectId: number; flagIds: number[]; onDone: () => void }) {
  const { message } = App.useApp();
  const [open, setOpen] = useState(false);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [form] = Form.useForm<AssignValues>();
  const setDue = Form.useWatch('setDue', form);
  const revalidate = useRevalidateFlags(projectId);

  const close = () => {
    setOpen(false);
    setProblem(null);
  };

  const submit = async (v: AssignValues) => {
    setProblem(null);
    setBusy(true);
    const body: BulkAssignFlagsRequest = { flagIds, assigneeId: v.assigneeId ?? null };
    if (v.setDue) body.dueDate = v.dueDate || null;
    try {
      const r = await bulkAssignFlags(projectId, body);
      void revalidate();
      void message.success(
        `${plural(r.updated.length, 'flag')} updated` +
          (r.skipped ? `; ${plural(r.skipped, 'flag')} skipped (closed, waived, or already so assigned).` : '.'),
      );
      close();
      form.resetFields();
      onDone();
    } catch (e) {
      if (!showFieldErrors(form, e, ['assigneeId', 'dueDate'])) setProblem(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <>
      <Button icon={<UserSwitchOutlined />} disabled={flagIds.length === 0} onClick={() => setOpen(true)}>
        Assign {flagIds.length ? plural(flagIds.length, 'selected flag') : 'selected flags'}
      </Button>
      <Modal open={open} title={`Assign ${plural(flagIds.length, 'flag')}`} footer={null} onCancel={close} destroyOnHidden={false} forceRender>
        <Form<AssignValues>
          form={form}
          name="bulk-assign"
          layout="vertical"
          requiredMark={false}
          aria-label="Assign the selected flags"
          initialValues={{ assigneeId: null, setDue: false, dueDate: '' }}
          onFinish={submit}
          disabled={busy}
        >
          <Form.Item label="Assignee" name="assigneeId" extra="“Nobody yet” unassigns them.">
            <EngineerSelect projectId={projectId} aria-label="Assignee" />
          </Form.Item>
          <Form.Item name="setDue" valuePropName="checked" style={{ marginBottom: 8 }}>
            <Checkbox>Also set the due date of every selected flag</Checkbox>
          </Form.Item>
          {setDue && (
            <Form.Item label="Due date" name="dueDate" extra="Empty: no due date.">
              <Input type="date" aria-label="Due date" />
            </Form.Item>
          )}
          {problem && <Alert type="error" showIcon title={problem} style={{ marginBottom: 12 }} />}
          <Flex gap={8} justify="end">
            <Button onClick={close}>Cancel</Button>
            <Button type="primary" htmlType="submit" loading={busy}>
              Assign
            </Button>
          </Flex>
        </Form>
      </Modal>
    </>
  );
}
