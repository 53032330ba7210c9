import { useState, type ReactNode } from 'react';
import { App, Alert, Button, Flex, Modal, Select, Tooltip, Typography } from 'antd';
import { UserSwitchOutlined } from '@ant-design/icons';
import { errorMessage } from '@/app/api-error';
import { assignMemberReviewers } from '../api/assign-member-reviewers';
import { useReviewerAssignments } from '../api/get-reviewer-assignments';
import { useRevalidateOverview } from '../api/revalidate-overview';

/**
 * For managers on the Members or Member screen: give these members a
 * reviewer of their own (it beats their level's and the schedule's), or take
 * it away so theirs applies again. Show it to managers and admins only, and
 * only for the latest revision (the API takes that revision's marks).
 *
 * After an assignment the overview, the assignments and every members request
 * on screen (the list, its facets, a member's page) are fetched again, and
 * `onDone` runs (the Members screen clears its ticks).
 */
export function AssignReviewerButton({
  projectId,
  marks,
  size,
  label = 'Assign reviewer',
  tooltip,
  onDone,
}: {
  projectId: number;
  marks: string[];
  size?: 'small' | 'middle';
  /** The button's text; say what it acts on ("Assign reviewer to 3 selected"). */
  label?: ReactNode;
  tooltip?: ReactNode;
  onDone?: () => void;
}) {
  const { message } = App.useApp();
  const [open, setOpen] = useState(false);
  const [chosen, setChosen] = useState<number | undefined>(undefined);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const assignments = useReviewerAssignments(projectId, open);
  const revalidate = useRevalidateOverview(projectId);
  const what = marks.length === 1 ? marks[0] : `${marks.length} members`;
  // One member that already has its own reviewer: the dialogue opens on that reviewer.
  const own =
    marks.length === 1 ? assignments.data?.members.find((a) => a.mark.toLowerCase() === marks[0].toLowerCase())?.reviewer : undefined;
  const value = chosen ?? own?.id ?? 0;
  const candidates = assignments.data?.candidates ?? [];
  const options = [
    { value: 0, label: 'Their level’s or the schedule’s reviewer' },
    ...candidates.map((c) => ({ value: c.id, label: c.name })),
    // Assigned while a checker, no longer one: still shown by name.
    ...(own && !candidates.some((c) => c.id === own.id) ? [{ value: own.id, label: `${own.name} (no longer a checker)` }] : []),
  ];

  const submit = async () => {
    setBusy(true);
    setProblem(null);
    try {
      const res = await assignMemberReviewers(projectId, { marks, reviewerId: value === 0 ? null : value });
      void message.success(
        res.reviewer
          ? `${res.reviewer.name} now reviews ${what}.`
          : `${what} follow${marks.length === 1 ? 's' : ''} the level's or the schedule's reviewer again.`,
      );
      setOpen(false);
      void revalidate();
      onDone?.();
    } catch (e) {
      setProblem(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  const button = (
    <Button
      size={size}
      icon={<UserSwitchOutlined />}
      disabled={marks.length === 0}
      onClick={() => {
        setProblem(null);
        setChosen(undefined);
        setOpen(true);
      }}
    >
      {label}
    </Button>
  );

  return (
    <>
      {tooltip ? <Tooltip title={tooltip}>{button}</Tooltip> : button}
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
            onChange={setChosen}
            options={options}
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
