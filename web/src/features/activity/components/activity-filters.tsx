import { useEffect, useState } from 'react';
import { Button, Flex, Input, Select, Typography } from 'antd';
import { ACTIVITY_KIND_LABELS, ACTIVITY_KINDS, ACTIVITY_LIMITS, type ActivityKind, type ActivityPerson } from '@sagline/common/api-types';
import { isFiltered, type ActivityView } from './activity-view';

/** Kind, person, days and words; every change goes to the address (the page reads it back). */
export function ActivityFilters({
  view,
  people,
  onChange,
  onClear,
}: {
  view: ActivityView;
  people: ActivityPerson[];
  onChange: (change: Partial<ActivityView>) => void;
  onClear: () => void;
}) {
  const [q, setQ] = useState(view.q);
  useEffect(() => setQ(view.q), [view.q]);
  const badRange = view.from !== '' && view.to !== '' && view.from > view.to;
  const label = (text: string) => (
    <Typography.Text type="secondary" style={{ fontSize: 12 }}>
      {text}
    </Typography.Text>
  );

  return (
    <Flex vertical gap={6}>
      <Flex wrap gap={12} align="flex-end">
        <Flex vertical gap={2} style={{ minWidth: 260, flex: '1 1 260px' }}>
          {label('Kind')}
          <Select<ActivityKind[]>
            mode="multiple"
            aria-label="Kind"
            allowClear
            placeholder="All kinds"
            value={view.kind}
            onChange={(kind) => onChange({ kind })}
            options={ACTIVITY_KINDS.map((k) => ({ value: k, label: ACTIVITY_KIND_LABELS[k] }))}
          />
        </Flex>
        <Flex vertical gap={2} style={{ width: 200 }}>
          {label('Person')}
          <Select<number>
            aria-label="Person"
            allowClear
            showSearch={{ optionFilterProp: 'label' }}
            placeholder="Everyone"
            value={view.actorId ?? undefined}
            onChange={(actorId) => onChange({ actorId: actorId ?? null })}
            options={[
              ...people.map((p) => ({ value: p.id, label: p.name })),
              // A person linked to from elsewhere who is not (yet) in the list.
              ...(view.actorId !== null && !people.some((p) => p.id === view.actorId) ? [{ value: view.actorId, label: `Person ${view.actorId}` }] : []),
            ]}
          />
        </Flex>
        <Flex vertical gap={2}>
          {label('From (UTC day)')}
          <Input type="date" aria-label="From" value={view.from} max={view.to || undefined} onChange={(e) => onChange({ from: e.target.value })} style={{ width: 160 }} />
        </Flex>
        <Flex vertical gap={2}>
          {label('To (UTC day)')}
          <Input type="date" aria-label="To" value={view.to} min={view.from || undefined} onChange={(e) => onChange({ to: e.target.value })} style={{ width: 160 }} />
        </Flex>
        <Flex vertical gap={2} style={{ minWidth: 220, flex: '1 1 220px' }}>
          {label('Words')}
          <Input.Search
            aria-label="Search the entries"
            placeholder="Mark, name, level…"
            allowClear
            maxLength={ACTIVITY_LIMITS.qMax}
            value={q}
            onChange={(e) => setQ(e.target.value)}
            onSearch={(value) => onChange({ q: value.trim() })}
          />
        </Flex>
        <Button onClick={onClear} disabled={!isFiltered(view)}>
          Clear filters
        </Button>
      </Flex>
      {badRange && (
        <Typography.Text type="danger" role="alert">
          The "To" day is before the "From" day: pick an end day on or after {view.from}.
        </Typography.Text>
      )}
    </Flex>
  );
}
