import { useState } from 'react';
import { App, Alert, Button, Flex, Modal, Select, Typography } from 'antd';
import { UserSwitchOutlined } from '@ant-design/icons';
import { errorMessage } from '@/app/api-error';
import { assignMemberReviewers } from '../api/assign-member-reviewers';
import { useReviewerAssignments } from '../api/get-reviewer-assignments';
import { useRevalidateOverview } from '../api/revalidate-overview';

/**
 * For managers on the Members or Member screen: give these members a
 * reviewer of their own (it beats their level's and the schedule's), or take
 * it away so theirs applies again. Show it to managers and admins only.
 */
export function AssignReviewerButton({ projectId, marks, size }: { projectId: number; marks: string[]; size?: 'small' | 'middle' }) {
  const { message } = App.useApp();
  const [open, setOpen] = useState(false);
  const [value, setValue] = useState<number>(0);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const assignments = useReviewerAssignments(projectId, open);
  const revalidate = useRevalidateOverview(projectId);
  const what = marks.length === 1 ? marks[0] : `${marks.length} members`;

  const submit = async () => {
    setBusy(true);
    setProblem(null);
    try {
      const res = await assignMemberReviewers(projectId, { marks, reviewerId: value === 0 ? null : value });
      void message.success(res.reviewer ? `${res.reviewer.name} now reviews ${what}.` : `${what} follow${marks.length === 1 ? 's' : ''} the level's or the schedule's reviewer again.`);
      setOpen(false);
      void revalidate();
    } catch (e) {
      setProblem(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  return (
    <>
      <Button size={size} icon={<UserSwitchOutlined />} disabled={marks.length === 0} onClick={() => { setProblem(null); setOpen(true); }}>
        Assign reviewer
      </Button>
      <Modal
        open={open}
        title={`Reviewer of ${what}`}
        okText="Assign"
        onOk={() => void submit()}
        confirmLoading={busy}
        onCancel={() => setOpen(false)}
        destroyOnHidden
      >
        <Flex vertical gap={12}>
          <Select
            aria-label={`Reviewer of ${what}`}
            value={value}
            loading={!assignments.data}
            onChange={setValue}
            options={[{ value: 0, label: 'Their level’s or the schedule’s reviewer' }, ...(assignments.data?.candidates ?? []).map((c) => ({ value: c.id, label: c.name }))]}
          />
          <Typography.Text type="secondary" style={{ fontSize: 12 }}>
            A member’s own reviewer beats the one assigned to its level, which beats the schedule’s Reviewer column. Reviewers are the
            project’s checkers.
          </Typography.Text>
          {problem && <Alert type="error" showIcon title={problem} />}
        </Flex>
      </Modal>
    </>
  );
}
