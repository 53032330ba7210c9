import { Alert, Flex, Table, Tabs, Typography } from 'antd';
import type { ColumnsType, ColumnType } from 'antd/es/table';
import type { ImportChangedMember, ImportDiff as Diff, ImportMemberRef, ImportVerdictFlip, Verdict } from '@sagline/common/api-types';
import { UtilisationBar } from '@/components/utilisation-bar';
import { VerdictTag } from '@/components/verdict-tag';

const VERDICT_WORD: Record<Verdict, string> = { pass: 'Pass', fail: 'Fail' };

/** Pass → fail reads as a warning (red), fail → pass as good news (green). */
export function FlipText({ from, to }: { from: Verdict; to: Verdict }) {
  return (
    <Typography.Text type={to === 'fail' ? 'danger' : 'success'} strong>
      {VERDICT_WORD[from]} → {VERDICT_WORD[to]}
      {to === 'fail' ? ' (now fails)' : ' (now passes)'}
    </Typography.Text>
  );
}

/**
 * One of the diff's tables: small, keyed by mark, paged past 50 rows, Mark
 * and Level first, then the table's own columns.
 */
function DiffTable<T extends { mark: string; level: string }>({
  rows,
  label,
  empty,
  columns,
}: {
  rows: T[];
  label: string;
  empty: string;
  columns: ColumnsType<T>;
}) {
  return (
    <Table<T>
      aria-label={label}
      size="small"
      rowKey="mark"
      dataSource={rows}
      pagination={rows.length > 50 ? { pageSize: 50 } : false}
      locale={{ emptyText: empty }}
      columns={[{ title: 'Mark', dataIndex: 'mark', width: 120 }, { title: 'Level', dataIndex: 'level', width: 90 }, ...columns]}
    />
  );
}

/** The member's largest utilisation as a number (no bar in the diff). */
function utilisationColumn<T extends { maxUtilization: number | null }>(): ColumnType<T> {
  return {
    title: 'Utilisation',
    dataIndex: 'maxUtilization',
    width: 110,
    align: 'right',
    render: (_v, r) => <UtilisationBar value={r.maxUtilization} bar={false} />,
  };
}

function MemberTable({ members, label, empty }: { members: ImportMemberRef[]; label: string; empty: string }) {
  return (
    <DiffTable<ImportMemberRef>
      rows={members}
      label={label}
      empty={empty}
      columns={[
        { title: 'Category', dataIndex: 'category' },
        { title: 'Verdict', dataIndex: 'verdict', width: 110, render: (_v, m) => <VerdictTag verdict={m.verdict} /> },
        utilisationColumn<ImportMemberRef>(),
      ]}
    />
  );
}

function ChangedTable({ members }: { members: ImportChangedMember[] }) {
  return (
    <DiffTable<ImportChangedMember>
      rows={members}
      label="Changed members"
      empty="No member changed."
      columns={[
        {
          title: 'What changed',
          key: 'changes',
          render: (_v, m) => (
            <Flex vertical gap={2}>
              {m.changes.map((c) => (
                <span key={c.field}>
                  <Typography.Text strong>{c.label}</Typography.Text>: {c.beforeText || '(empty)'} →{' '}
                  {c.afterText || '(empty)'}
                </span>
              ))}
            </Flex>
          ),
        },
        {
          title: 'Verdict',
          key: 'verdict',
          width: 170,
          render: (_v, m) => (
            <>
              <VerdictTag verdict={m.verdictBefore} /> → <VerdictTag verdict={m.verdict} />
            </>
          ),
        },
      ]}
    />
  );
}

function FlipsTable({ flips }: { flips: ImportVerdictFlip[] }) {
  return (
    <DiffTable<ImportVerdictFlip>
      rows={flips}
      label="Verdicts that flip"
      empty="No verdict flips."
      columns={[
        { title: 'Verdict', key: 'flip', width: 220, render: (_v, f) => <FlipText from={f.from} to={f.to} /> },
        {
          title: 'Governing check',
          dataIndex: 'governingCheck',
          render: (_v, f) => f.governingCheck ?? <Typography.Text type="secondary">—</Typography.Text>,
        },
        utilisationColumn<ImportVerdictFlip>(),
      ]}
    />
  );
}

/**
 * What committing the draft would change against the latest revision:
 * added, removed and changed members (field by field) and the verdicts
 * that flip. Opens on the flips when there are any: they are what a
 * checker will ask about.
 */
export function ImportDiff({ diff }: { diff: Diff }) {
  const toFail = diff.flips.filter((f) => f.to === 'fail').length;
  const toPass = diff.flips.length - toFail;
  const nothing = diff.added.length + diff.removed.length + diff.changed.length === 0;
  const first = !diff.against;

  return (
    <Flex vertical gap={8}>
      <Typography.Text>
        {first ? (
          'This is the first revision of the project: every member is new.'
        ) : (
          <>
            Against revision {diff.against!.number}
            {diff.against!.label ? `, “${diff.against!.label}”` : ''}: {diff.added.length} added, {diff.removed.length}{' '}
            removed, {diff.changed.length} changed, {diff.unchanged} unchanged.{' '}
            {diff.flips.length > 0 && (
              <Typography.Text type={toFail > 0 ? 'danger' : 'success'}>
                {toFail > 0 && `${toFail} now ${toFail === 1 ? 'fails' : 'fail'}`}
                {toFail > 0 && toPass > 0 && ', '}
                {toPass > 0 && `${toPass} now ${toPass === 1 ? 'passes' : 'pass'}`}.
              </Typography.Text>
            )}
          </>
        )}
      </Typography.Text>
      {!first && nothing && (
        <Alert
          type="info"
          showIcon
          title={`No changes: every member is the same as in revision ${diff.against!.number}.`}
          description="Committing still keeps this file as a new revision."
        />
      )}
      <Tabs
        defaultActiveKey={diff.flips.length > 0 ? 'flips' : first ? 'added' : diff.changed.length > 0 ? 'changed' : 'added'}
        items={[
          {
            key: 'added',
            label: `Added (${diff.added.length})`,
            children: <MemberTable members={diff.added} label="Added members" empty="No member added." />,
          },
          {
            key: 'removed',
            label: `Removed (${diff.removed.length})`,
            children: <MemberTable members={diff.removed} label="Removed members" empty="No member removed." />,
          },
          { key: 'changed', label: `Changed (${diff.changed.length})`, children: <ChangedTable members={diff.changed} /> },
          {
            key: 'flips',
            label: `Verdicts that flip (${diff.flips.length})`,
            children: <FlipsTable flips={diff.flips} />,
          },
        ]}
      />
    </Flex>
  );
}
