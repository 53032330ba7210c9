import { Descriptions, Typography } from 'antd';
import type { MemberDetail, ReviewerAssignments } from '@sagline/common/api-types';
import { Quantity } from '@/components/quantity';
import { categoryLabel, materialLabel, spansText, supportsLabel } from './member-labels';

/**
 * Where the member's reviewer comes from (overview README: its own assignment beats its level's,
 * which beats the schedule's column), for managers who change it. Null while unknown.
 */
export function reviewerSource(detail: MemberDetail, assignments: ReviewerAssignments | undefined): string | null {
  const m = detail.member;
  if (!assignments || !detail.isLatest || !m.reviewer) return null;
  const own = assignments.members.find((a) => a.mark.toLowerCase() === m.mark.toLowerCase());
  if (own && own.reviewer.id === m.reviewer.id) return 'its own assignment';
  const level = assignments.levels.find((l) => l.level.id === m.level.id);
  if (level?.reviewer && level.reviewer.id === m.reviewer.id) return `assigned to ${level.level.name}`;
  return 'from the schedule';
}

/** What the schedule says about the member (in the project's units) and where in the file it came from. */
export function MemberFacts({ detail, reviewerFrom }: { detail: MemberDetail; reviewerFrom?: string | null }) {
  const m = detail.member;
  const system = detail.unitSystem;
  const none = <Typography.Text type="secondary">—</Typography.Text>;
  return (
    <Descriptions
      size="small"
      column={{ xs: 1, sm: 2, lg: 3 }}
      items={[
        { key: 'level', label: 'Level', children: m.level.name },
        { key: 'grid', label: 'Grid', children: m.grid ?? none },
        { key: 'category', label: 'Category', children: categoryLabel(m.category) },
        { key: 'material', label: 'Material', children: materialLabel(m.material) },
        { key: 'section', label: 'Section', children: m.section ?? none },
        { key: 'supports', label: 'Supports', children: supportsLabel(m.supports) },
        { key: 'spans', label: 'Spans', children: spansText(m, system) },
        { key: 'length', label: 'Length', children: <Quantity si={m.length} quantity="span" system={system} /> },
        { key: 'E', label: 'E', children: <Quantity si={m.E} quantity="modulus" system={system} /> },
        { key: 'I', label: 'I', children: <Quantity si={m.I} quantity="inertia" system={system} /> },
        {
          key: 'requiredI',
          label: 'I required',
          children:
            m.requiredI === null ? (
              none
            ) : (
              <Quantity si={m.requiredI} quantity="inertia" system={system} style={m.verdict === 'fail' ? { fontWeight: 600 } : undefined} />
            ),
        },
        { key: 'depth', label: 'Depth', children: m.depth === null ? none : <Quantity si={m.depth} quantity="depth" system={system} /> },
        { key: 'camber', label: 'Camber', children: m.camber === null ? none : <Quantity si={m.camber} quantity="camber" system={system} /> },
        {
          key: 'reviewer',
          label: 'Reviewer',
          children: m.reviewer ? (
            // One span: the item's content is a flex box, which would drop the space between two children.
            <span>
              {m.reviewer.name}
              {reviewerFrom && <Typography.Text type="secondary"> ({reviewerFrom})</Typography.Text>}
            </span>
          ) : m.reviewerEmail ? (
            `${m.reviewerEmail} (not on the team)`
          ) : (
            none
          ),
        },
        { key: 'source', label: 'Schedule row', children: `Members sheet, row ${m.sourceRow}` },
        ...(m.notes ? [{ key: 'notes', label: 'Notes', children: m.notes, span: 'filled' as const }] : []),
      ]}
    />
  );
}
