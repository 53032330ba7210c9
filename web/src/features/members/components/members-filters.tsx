import { useEffect, useState } from 'react';
import { Button, Flex, Input, InputNumber, Select, Typography } from 'antd';
import { CloseOutlined, WarningOutlined } from '@ant-design/icons';
import type { MemberFacets } from '@sagline/common/api-types';
import { categoryLabel, materialLabel } from './member-labels';
import { hasFilters, isFailingOnly, MEMBER_VERDICT_FILTERS, withFilters, type MembersView, type MemberVerdictFilter } from './member-query';

const VERDICT_WORDS: Record<MemberVerdictFilter, string> = { pass: 'Pass', fail: 'Fail', unchecked: 'No check' };

/** "L3 · 24 (3 failing)" */
function counted(name: string, count: number, failCount: number): string {
  return failCount > 0 ? `${name} · ${count} (${failCount} failing)` : `${name} · ${count}`;
}

const SELECT_WIDTH = { minWidth: 170, maxWidth: 320 };

/**
 * The Members filters. Each change goes to `onChange` as a whole new view
 * (back to page 1); the page writes it into the URL, and the URL is what the
 * table loads. Choices and their counts come from the revision's facets.
 */
export function MembersFilters({
  view,
  facets,
  onChange,
}: {
  view: MembersView;
  facets: MemberFacets | undefined;
  onChange: (next: MembersView) => void;
}) {
  const set = (change: Partial<MembersView>) => onChange(withFilters(view, change));
  const failingOnly = isFailingOnly(view);
  const failing = facets?.verdicts.fail;

  return (
    <Flex vertical gap={10} role="search" aria-label="Filter members">
      <Flex gap={8} wrap align="center">
        <SearchBox value={view.q} onSearch={(q) => set({ q })} />
        <Button
          type={failingOnly ? 'primary' : 'default'}
          danger={!failingOnly}
          icon={<WarningOutlined />}
          aria-pressed={failingOnly}
          onClick={() => set({ verdict: failingOnly ? [] : ['fail'] })}
        >
          Failing only{failing !== undefined ? ` (${failing})` : ''}
        </Button>
        <Select<MemberVerdictFilter[]>
          mode="multiple"
          allowClear
          aria-label="Verdict"
          placeholder="Verdict"
          style={{ minWidth: 150 }}
          value={view.verdict}
          onChange={(verdict) => set({ verdict })}
          options={MEMBER_VERDICT_FILTERS.map((v) => ({
            value: v,
            label: facets ? `${VERDICT_WORDS[v]} · ${facets.verdicts[v]}` : VERDICT_WORDS[v],
          }))}
        />
        <UtilisationRange min={view.utilMin} max={view.utilMax} onChange={(utilMin, utilMax) => set({ utilMin, utilMax })} />
        {hasFilters(view) && (
          <Button
            type="link"
            icon={<CloseOutlined />}
            onClick={() =>
              set({ level: [], category: [], material: [], reviewer: [], verdict: [], check: [], utilMin: null, utilMax: null, q: '' })
            }
          >
            Clear filters
          </Button>
        )}
      </Flex>
      <Flex gap={8} wrap>
        <Select<string[]>
          mode="multiple"
          allowClear
          aria-label="Level"
          placeholder="Level"
          style={SELECT_WIDTH}
          value={view.level}
          onChange={(level) => set({ level })}
          optionFilterProp="label"
          options={choices(
            view.level,
            (facets?.levels ?? []).filter((l) => l.id !== null).map((l) => ({ value: String(l.id), label: counted(l.name, l.count, l.failCount) })),
            (v) => `Level #${v}`,
          )}
        />
        <Select<string[]>
          mode="multiple"
          allowClear
          aria-label="Category"
          placeholder="Category"
          style={SELECT_WIDTH}
          value={view.category}
          onChange={(category) => set({ category })}
          optionFilterProp="label"
          popupMatchSelectWidth={false}
          options={choices(
            view.category,
            (facets?.categories ?? []).map((c) => ({ value: c.value, label: counted(categoryLabel(c.value), c.count, c.failCount) })),
            categoryLabel,
          )}
        />
        <Select<string[]>
          mode="multiple"
          allowClear
          aria-label="Material"
          placeholder="Material"
          style={SELECT_WIDTH}
          value={view.material}
          onChange={(material) => set({ material })}
          optionFilterProp="label"
          popupMatchSelectWidth={false}
          options={choices(
            view.material,
            (facets?.materials ?? []).map((c) => ({ value: c.value, label: counted(materialLabel(c.value), c.count, c.failCount) })),
            materialLabel,
          )}
        />
        <Select<string[]>
          mode="multiple"
          allowClear
          aria-label="Reviewer"
          placeholder="Reviewer"
          style={SELECT_WIDTH}
          value={view.reviewer}
          onChange={(reviewer) => set({ reviewer })}
          optionFilterProp="label"
          popupMatchSelectWidth={false}
          options={choices(
            view.reviewer,
            (facets?.reviewers ?? []).map((r) => ({
              value: r.id === null ? 'none' : String(r.id),
              label: counted(r.id === null ? 'Not on the team' : (r.name ?? `#${r.id}`), r.count, r.failCount),
            })),
            (v) => (v === 'none' ? 'Not on the team' : `Reviewer #${v}`),
          )}
        />
        <Select<string[]>
          mode="multiple"
          allowClear
          aria-label="Fails check"
          placeholder="Fails check"
          style={{ minWidth: 190, maxWidth: 360 }}
          value={view.check}
          onChange={(check) => set({ check })}
          optionFilterProp="label"
          popupMatchSelectWidth={false}
          options={choices(
            view.check,
            (facets?.checks ?? []).map((c) => ({ value: c.name, label: `${c.name} · ${c.failCount} failing` })),
            (v) => v,
          )}
        />
      </Flex>
    </Flex>
  );
}

/**
 * The facet options, plus any value the URL holds that the facets do not
 * list (another revision's level, a hand-written link), so a chosen filter
 * is always visible and can be removed.
 */
function choices(
  chosen: string[],
  options: { value: string; label: string }[],
  fallback: (value: string) => string,
): { value: string; label: string }[] {
  const known = new Set(options.map((o) => o.value));
  return [...options, ...chosen.filter((v) => !known.has(v)).map((v) => ({ value: v, label: fallback(v) }))];
}

/** Text on mark or grid: applied on Enter, on clearing, and a moment after typing stops. */
function SearchBox({ value, onSearch }: { value: string; onSearch: (q: string) => void }) {
  const [text, setText] = useState(value);
  useEffect(() => setText(value), [value]);
  useEffect(() => {
    if (text.trim() === value.trim()) return;
    const timer = setTimeout(() => onSearch(text.trim()), 400);
    return () => clearTimeout(timer);
  }, [text, value, onSearch]);
  return (
    <Input.Search
      aria-label="Mark or grid contains"
      placeholder="Mark or grid contains…"
      allowClear
      style={{ width: 240 }}
      value={text}
      maxLength={100}
      onChange={(e) => setText(e.target.value)}
      onSearch={(q) => onSearch(q.trim())}
    />
  );
}

/** Utilisation from … to …, applied when a box is left or Enter is pressed. */
function UtilisationRange({
  min,
  max,
  onChange,
}: {
  min: number | null;
  max: number | null;
  onChange: (min: number | null, max: number | null) => void;
}) {
  const [lo, setLo] = useState<number | null>(min);
  const [hi, setHi] = useState<number | null>(max);
  useEffect(() => setLo(min), [min]);
  useEffect(() => setHi(max), [max]);
  const apply = () => {
    if (lo !== min || hi !== max) onChange(lo, hi);
  };
  const swapped = lo !== null && hi !== null && lo > hi;
  return (
    <Flex gap={4} align="center">
      <Typography.Text type="secondary">Utilisation</Typography.Text>
      <InputNumber<number>
        aria-label="Utilisation from"
        placeholder="from"
        min={0}
        step={0.1}
        style={{ width: 82 }}
        value={lo}
        status={swapped ? 'error' : undefined}
        onChange={(v) => setLo(v ?? null)}
        onBlur={apply}
        onPressEnter={apply}
      />
      <Typography.Text type="secondary">–</Typography.Text>
      <InputNumber<number>
        aria-label="Utilisation to"
        placeholder="to"
        min={0}
        step={0.1}
        style={{ width: 82 }}
        value={hi}
        status={swapped ? 'error' : undefined}
        onChange={(v) => setHi(v ?? null)}
        onBlur={apply}
        onPressEnter={apply}
      />
      {swapped && (
        <Typography.Text type="danger" style={{ fontSize: 12 }}>
          “from” is above “to”: nothing can match.
        </Typography.Text>
      )}
    </Flex>
  );
}
