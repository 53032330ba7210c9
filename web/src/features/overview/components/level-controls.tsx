import { useState } from 'react';
import { App, Button, Flex, Input, Popover, Select, Space, Tag, Tooltip, Typography } from 'antd';
import type { OverviewLevelRow, ReviewerAssignments } from '@sagline/common/api-types';
import { errorMessage } from '@/app/api-error';
import { assignLevelReviewer } from '../api/assign-level-reviewer';
import { signOffLevel, withdrawSignOff } from '../api/sign-off-level';
import { signOffText } from './overview-labels';

/** A manager's choice of reviewer for one level (the project's checkers; "none" goes back to the schedule's). */
export function LevelReviewerSelect({
  projectId,
  row,
  assignments,
  onChanged,
}: {
  projectId: number;
  row: OverviewLevelRow;
  assignments: ReviewerAssignments | undefined;
  onChanged: () => void;
}) {
  const { message } = App.useApp();
  const [busy, setBusy] = useState(false);
  const level = row.level;
  if (!level || level.id === null) return null;
  const levelId = level.id;
  const options = [
    { value: 0, label: 'From the schedule' },
    ...(assignments?.candidates ?? []).map((c) => ({ value: c.id, label: c.name })),
  ];
  // Someone assigned while a checker keeps the level after a role change: still shown by name.
  const current = row.assignedReviewer;
  if (current && !options.some((o) => o.value === current.id)) options.push({ value: current.id, label: `${current.name} (no longer a checker)` });
  const change = async (value: number) => {
    setBusy(true);
    try {
      await assignLevelReviewer(projectId, levelId, { reviewerId: value === 0 ? null : value });
      const name = options.find((o) => o.value === value)?.label;
      void message.success(value === 0 ? `${level.name} follows the schedule's reviewers again.` : `${name} now reviews ${level.name}.`);
      onChanged();
    } catch (e) {
      void message.error(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };
  return (
    <Select
      size="small"
      style={{ minWidth: 170 }}
      aria-label={`Reviewer of ${level.name}`}
      value={row.assignedReviewer?.id ?? 0}
      options={options}
      loading={busy || !assignments}
      disabled={busy}
      onChange={(v) => void change(v)}
    />
  );
}

/** The sign-off state of a level and, for checkers, the action that fits it. */
export function SignOffCell({ projectId, row, canSignOff, onChanged }: { projectId: number; row: OverviewLevelRow; canSignOff: boolean; onChanged: () => void }) {
  const { message } = App.useApp();
  const [open, setOpen] = useState<'sign' | 'withdraw' | null>(null);
  const [text, setText] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const level = row.level;
  if (!level || level.id === null) return null;
  const levelId = level.id;
  const s = row.signOff;
  const live = s?.state === 'signed';
  const needsAction = row.flagsOpen + row.flagsAnswered;

  const submit = async () => {
    setBusy(true);
    setProblem(null);
    try {
      if (open === 'sign') await signOffLevel(projectId, levelId, text.trim() ? { comment: text.trim() } : {});
      else await withdrawSignOff(projectId, levelId, { reason: text.trim() });
      void message.success(open === 'sign' ? `${level.name} is signed off.` : `The sign-off of ${level.name} is withdrawn.`);
      setOpen(null);
      setText('');
      onChanged();
    } catch (e) {
      setProblem(errorMessage(e));
    } finally {
      setBusy(false);
    }
  };

  const form = (
    <Flex vertical gap={8} style={{ width: 300 }}>
      <Input.TextArea
        aria-label={open === 'sign' ? `Comment on the sign-off of ${level.name}` : `Why the sign-off of ${level.name} is withdrawn`}
        placeholder={open === 'sign' ? 'Comment (optional)' : 'Why (required)'}
        value={text}
        onChange={(e) => setText(e.target.value)}
        autoSize={{ minRows: 2, maxRows: 5 }}
        maxLength={2000}
      />
      {problem && <Typography.Text type="danger">{problem}</Typography.Text>}
      <Space>
        <Button
          type="primary"
          size="small"
          loading={busy}
          disabled={open === 'withdraw' && !text.trim()}
          onClick={() => void submit()}
          aria-label={open === 'sign' ? `Confirm the sign-off of ${level.name}` : `Confirm the withdrawal of the sign-off of ${level.name}`}
        >
          {open === 'sign' ? `Sign off ${level.name}` : 'Withdraw'}
        </Button>
        <Button size="small" onClick={() => setOpen(null)}>
          Cancel
        </Button>
      </Space>
    </Flex>
  );

  const state = s ? (
    <Tooltip title={signOffText(s)}>
      {live ? <Tag color="green">Signed off</Tag> : <Tag color="red">Void</Tag>}
    </Tooltip>
  ) : (
    <Typography.Text type="secondary">Not signed off</Typography.Text>
  );

  let action = null;
  if (canSignOff && row.members > 0) {
    const mode = live ? 'withdraw' : 'sign';
    const blocked = !live && needsAction > 0;
    const button = (
      <Button size="small" disabled={blocked} onClick={() => { setText(''); setProblem(null); setOpen(mode); }} aria-label={live ? `Withdraw the sign-off of ${level.name}` : `Sign off ${level.name}`}>
        {live ? 'Withdraw' : 'Sign off'}
      </Button>
    );
    action = (
      <Popover open={open !== null} onOpenChange={(v) => !v && setOpen(null)} trigger="click" content={form} title={live ? `Withdraw the sign-off of ${level.name}` : `Sign off ${level.name}`}>
        {blocked ? <Tooltip title={`${needsAction} flag${needsAction === 1 ? '' : 's'} on ${level.name} still need${needsAction === 1 ? 's' : ''} action: close or waive ${needsAction === 1 ? 'it' : 'them'} first.`}>{button}</Tooltip> : button}
      </Popover>
    );
  }

  return (
    <Flex vertical gap={2}>
      <Space size={6} wrap>
        {state}
        {action}
      </Space>
      {s && s.state === 'voided' && (
        <Typography.Text type="danger" style={{ fontSize: 12, maxWidth: 320 }}>
          {s.voidReason}
        </Typography.Text>
      )}
      {s && live && (
        <Typography.Text type="secondary" style={{ fontSize: 12 }}>
          {s.signedBy?.name ?? 'Someone'}, revision {s.revisionNumber}
        </Typography.Text>
      )}
      {s && live && needsAction > 0 && (
        <Typography.Text type="warning" style={{ fontSize: 12, maxWidth: 320 }}>
          {needsAction} flag{needsAction === 1 ? '' : 's'} on it need{needsAction === 1 ? 's' : ''} action since; withdraw the sign-off if it no longer holds.
        </Typography.Text>
      )}
    </Flex>
  );
}
