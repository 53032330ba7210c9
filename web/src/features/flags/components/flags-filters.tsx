import { useEffect, useState } from 'react';
import { Button, Flex, Input, Select, Switch, Typography } from 'antd';
import { FLAG_LIMITS, FLAG_STATUSES, type FlagStatus, type Level } from '@sagline/common/api-types';
import { useCheckNames } from '../api/get-check-names';
import { useEngineers } from '../api/get-engineers';
import { useFlagSummary } from '../api/get-flag-summary';
import { FLAG_STATUS_LABELS } from './flag-status-tag';
import { DEFAULT_FLAGS_VIEW, hasFlagFilters, withFlagFilters, type FlagsView } from './flag-query';

/**
 * The filters of the Flags screen: status, assignee (me, nobody, a person),
 * level, text in the mark, check, overdue only. Each change goes to the address.
 */
export function FlagsFilters({
  projectId,
  levels,
  view,
  onChange,
  showStatus = true,
}: {
  projectId: number;
  levels: Level[];
  view: FlagsView;
  onChange: (next: FlagsView) => void;
  /** The board shows every status as a column; the filter is for the table. */
  showStatus?: boolean;
}) {
  const summary = useFlagSummary(projectId);
  const { engineers } = useEngineers(projectId);
  const { names: checks } = useCheckNames(projectId);
  const [mark, setMark] = useState(view.mark);
  useEffect(() => setMark(view.mark), [view.mark]);

  // Everyone who holds flags (from the counts) and every engineer who could.
  const people = new Map<string, string>();
  for (const a of summary.data?.byAssignee ?? []) if (a.assignee) people.set(String(a.assignee.id), a.assignee.name);
  for (const e of engineers) if (!people.has(String(e.userId))) people.set(String(e.userId), e.name || e.email);
  // A person named by the address keeps a readable option while the lists load.
  for (const a of view.assignee) if (/^\d+$/.test(a) && !people.has(a)) people.set(a, `Person ${a}`);
  const assigneeOptions = [
    { value: 'me', label: 'Me' },
    { value: 'none', label: 'Nobody (unassigned)' },
    ...[...people].sort((a, b) => a[1].localeCompare(b[1])).map(([value, label]) => ({ value, label })),
  ];

  const set = (change: Partial<FlagsView>) => onChange(withFlagFilters(view, change));

  return (
    <Flex gap={12} wrap align="end" role="search" aria-label="Flag filters">
      {showStatus && (
        <label>
          <Typography.Text type="secondary" style={{ display: 'block', fontSize: 12 }}>
            Status
          </Typography.Text>
          <Select<FlagStatus[]>
            mode="multiple"
            aria-label="Status"
            allowClear
            placeholder="Any status"
            style={{ minWidth: 200 }}
            value={view.status}
            onChange={(status) => set({ status })}
            options={FLAG_STATUSES.map((s) => ({ value: s, label: FLAG_STATUS_LABELS[s] }))}
          />
        </label>
      )}
      <label>
        <Typography.Text type="secondary" style={{ display: 'block', fontSize: 12 }}>
          Assignee
        </Typography.Text>
        <Select<string[]>
          mode="multiple"
          aria-label="Assignee"
          allowClear
          placeholder="Anyone"
          style={{ minWidth: 200 }}
          value={view.assignee}
          onChange={(assignee) => set({ assignee })}
          options={assigneeOptions}
          showSearch={{ optionFilterProp: 'label' }}
        />
      </label>
      <label>
        <Typography.Text type="secondary" style={{ display: 'block', fontSize: 12 }}>
          Level
        </Typography.Text>
        <Select<string[]>
          mode="multiple"
          aria-label="Level"
          allowClear
          placeholder="Every level"
          style={{ minWidth: 160 }}
          value={view.level}
          onChange={(level) => set({ level })}
          options={[...levels].sort((a, b) => a.position - b.position).map((l) => ({ value: String(l.id), label: l.name }))}
        />
      </label>
      <label>
        <Typography.Text type="secondary" style={{ display: 'block', fontSize: 12 }}>
          Mark contains
        </Typography.Text>
        <Input.Search
          aria-label="Mark contains"
          allowClear
          placeholder="e.g. L3-B"
          style={{ width: 180 }}
          maxLength={FLAG_LIMITS.markMax}
          value={mark}
          onChange={(e) => {
            setMark(e.target.value);
            if (e.target.value === '' && view.mark) set({ mark: '' });
          }}
          onSearch={(v) => set({ mark: v.trim() })}
        />
      </label>
      <label>
        <Typography.Text type="secondary" style={{ display: 'block', fontSize: 12 }}>
          Check
        </Typography.Text>
        <Select<string>
          aria-label="Check"
          allowClear
          placeholder="Any check"
          style={{ minWidth: 170 }}
          value={view.check ?? undefined}
          onChange={(check) => set({ check: check ?? null })}
          options={[...new Set([...checks, ...(view.check ? [view.check] : [])])].map((c) => ({ value: c, label: c }))}
          popupMatchSelectWidth={false}
        />
      </label>
      <Flex gap={6} align="center" style={{ height: 32 }}>
        <Switch aria-label="Overdue only" checked={view.overdue} onChange={(overdue) => set({ overdue })} size="small" />
        <Typography.Text>Overdue only</Typography.Text>
      </Flex>
      {hasFlagFilters(view) && (
        <Button
          type="link"
          onClick={() => onChange({ ...DEFAULT_FLAGS_VIEW, sort: view.sort, pageSize: view.pageSize, board: view.board })}
        >
          Clear filters
        </Button>
      )}
    </Flex>
  );
}
