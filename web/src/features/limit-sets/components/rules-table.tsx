import { Flex, Table, Tag, Tooltip, Typography } from 'antd';
import type { ColumnsType } from 'antd/es/table';
import type { LimitPresetView, LimitSetRuleView } from '@sagline/common/api-types';
import type { UnitSystemId } from '@sagline/common/units';
import { formatCombination } from './combination-text';
import { lengthText, limitText } from './limit-text';

const TRUST_COLOR: Record<string, string> = { verified: 'green', 'from memory': 'gold', 'common practice': 'default' };

/** The trust mark of a source, with what it means. */
export function TrustTag({ trust }: { trust: string }) {
  const meaning: Record<string, string> = {
    verified: 'Read in the published text (or a faithful quotation).',
    'from memory': 'Not checked against the adopted edition: check it before relying on it.',
    'common practice': 'What engineers usually do; no standard behind it.',
  };
  return (
    <Tooltip title={meaning[trust] ?? trust}>
      <Tag color={TRUST_COLOR[trust] ?? 'default'} style={{ marginInlineEnd: 0 }}>
        {trust}
      </Tag>
    </Tooltip>
  );
}

/** A rule's source: document and edition, the table or clause, its trust mark and note. */
export function RuleSource({ source }: { source: LimitSetRuleView['source'] }) {
  return (
    <Flex vertical gap={2}>
      <Typography.Text>
        {source.document}, {source.edition}
      </Typography.Text>
      <Flex gap={6} align="center" wrap>
        <Typography.Text type="secondary">{source.clause}</Typography.Text>
        <TrustTag trust={source.trust} />
      </Flex>
      {source.note && (
        <Typography.Paragraph type="secondary" style={{ fontSize: 12, margin: 0 }} ellipsis={{ rows: 2, expandable: true, symbol: 'more' }}>
          {source.note}
        </Typography.Paragraph>
      )}
    </Flex>
  );
}

/**
 * The rules of a set, read-only, grouped by member category in the set's
 * order: the check, its combination, the limit in the project's units, the
 * materials it is for, and its source.
 */
export function RulesTable({
  rules,
  categories,
  system,
  label,
}: {
  rules: LimitSetRuleView[];
  categories: LimitPresetView['categories'];
  system: UnitSystemId;
  label: string;
}) {
  const order = new Map(categories.map((c, i) => [c.id, i]));
  const labelOf = new Map(categories.map((c) => [c.id, c.label]));
  const sorted = [...rules].sort((a, b) => (order.get(a.category) ?? 999) - (order.get(b.category) ?? 999));
  const columns: ColumnsType<LimitSetRuleView> = [
    {
      title: 'Member category',
      key: 'category',
      width: 190,
      render: (_, r, i) => (i > 0 && sorted[i - 1].category === r.category ? null : <Typography.Text strong>{labelOf.get(r.category) ?? r.category}</Typography.Text>),
    },
    { title: 'Check', dataIndex: 'check', key: 'check', width: 190 },
    { title: 'Combination', key: 'combination', width: 110, render: (_, r) => <Typography.Text code>{formatCombination(r.combination)}</Typography.Text> },
    {
      title: 'Limit',
      key: 'limit',
      width: 190,
      render: (_, r) => {
        const len = lengthText(r, system);
        return (
          <Flex vertical>
            <span style={{ fontVariantNumeric: 'tabular-nums' }}>{limitText(r, system)}</span>
            {len && <Typography.Text type="secondary" style={{ fontSize: 12 }}>{len}</Typography.Text>}
          </Flex>
        );
      },
    },
    {
      title: 'Materials',
      key: 'materials',
      width: 130,
      render: (_, r) => (r.materials ? r.materials.join(', ') : <Typography.Text type="secondary">any</Typography.Text>),
    },
    { title: 'Source', key: 'source', render: (_, r) => <RuleSource source={r.source} /> },
  ];
  return (
    <Table<LimitSetRuleView>
      aria-label={label}
      size="small"
      rowKey="id"
      columns={columns}
      dataSource={sorted}
      pagination={false}
      scroll={{ x: 1000 }}
      locale={{ emptyText: 'No rules yet: a member of any category has no check under this set.' }}
    />
  );
}
