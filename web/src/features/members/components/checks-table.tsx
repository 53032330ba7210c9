import { Button, Table, Tooltip, Typography } from 'antd';
import type { LimitRuleView, MemberDetail, MemberResultView } from '@sagline/common/api-types';
import { formatQuantity } from '@sagline/common/units';
import { Quantity } from '@/components/quantity';
import { UtilisationBar } from '@/components/utilisation-bar';
import { VerdictTag } from '@/components/verdict-tag';
import { limitText, ratioText, segmentName, signedDeflection } from './member-words';

/** A stable key for one result: check × segment. */
export const resultKey = (r: Pick<MemberResultView, 'checkName' | 'segmentIndex'>) => `${r.checkName}#${r.segmentIndex}`;

/** The result with the largest utilisation (the governing one), or undefined without checks. */
export function governingResult(results: readonly MemberResultView[]): MemberResultView | undefined {
  return results.reduce<MemberResultView | undefined>((best, r) => (!best || r.utilization > best.utilization ? r : best), undefined);
}

/**
 * Every check of the member on every segment, as stored with the revision:
 * effective length, deflection (signed, positive up), span ratio, the limit
 * with its published source, utilisation, verdict, and the I that would pass.
 * "Contributions" opens the hand calculation of that row.
 */
export function ChecksTable({
  detail,
  selected,
  onSelect,
}: {
  detail: MemberDetail;
  selected: string | null;
  onSelect: (result: MemberResultView) => void;
}) {
  const system = detail.unitSystem;
  const rules = new Map<string, LimitRuleView>(detail.rules.map((r) => [r.id, r]));
  const segments = detail.report.segments;
  const governing = governingResult(detail.results);
  return (
    <Table<MemberResultView>
      aria-label="Checks"
      size="small"
      rowKey={resultKey}
      pagination={false}
      dataSource={detail.results}
      scroll={{ x: 1180 }}
      rowClassName={(r) => (resultKey(r) === selected ? 'ant-table-row-selected' : '')}
      locale={{ emptyText: 'No check of the limit set applies to this member (its category, material or loads).' }}
      columns={[
        {
          title: 'Check',
          dataIndex: 'checkName',
          width: 140,
          render: (_v, r) => (
            <Typography.Text strong={governing !== undefined && resultKey(r) === resultKey(governing)}>
              {r.checkName}
              {governing !== undefined && resultKey(r) === resultKey(governing) && (
                <Typography.Text type="secondary" style={{ fontSize: 12, fontWeight: 400 }}>
                  {' '}
                  (governing)
                </Typography.Text>
              )}
            </Typography.Text>
          ),
        },
        {
          title: 'Segment',
          key: 'segment',
          width: 95,
          render: (_v, r) => segmentName({ kind: r.segmentKind, from: r.segmentFrom }, r.segmentIndex, segments),
        },
        {
          title: 'Effective length',
          dataIndex: 'effectiveLength',
          width: 95,
          align: 'right',
          render: (_v, r) => (
            <Tooltip title={r.segmentKind === 'overhang' ? 'Twice the overhang (IBC 2021 Table 1604.3, cantilever footnote)' : 'The span'}>
              <span>
                <Quantity si={r.effectiveLength} quantity="span" system={system} />
              </span>
            </Tooltip>
          ),
        },
        {
          title: 'Deflection',
          dataIndex: 'deflection',
          width: 110,
          align: 'right',
          render: (_v, r) => (
            <span style={{ fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' }} title={`at x = ${formatQuantity(r.x, 'position', system)}`}>
              {signedDeflection(r.deflection, system)}
            </span>
          ),
        },
        {
          title: 'Span ratio',
          dataIndex: 'spanRatio',
          width: 80,
          align: 'right',
          render: (_v, r) => <span style={{ fontVariantNumeric: 'tabular-nums' }}>{ratioText(r.spanRatio)}</span>,
        },
        {
          title: 'Limit',
          key: 'limit',
          width: 230,
          render: (_v, r) => {
            const rule = rules.get(r.ruleId);
            return (
              <div>
                <div style={{ whiteSpace: 'nowrap' }}>
                  {limitText(r, system)}{' '}
                  <Typography.Text type="secondary" style={{ fontVariantNumeric: 'tabular-nums' }}>
                    = {formatQuantity(r.allowed, 'deflection', system)}
                    {r.governing === 'maxAbs' ? ' (cap governs)' : ''}
                  </Typography.Text>
                </div>
                {rule && (
                  <Typography.Text type="secondary" style={{ fontSize: 12 }} data-testid="limit-source">
                    {rule.sourceText}
                  </Typography.Text>
                )}
              </div>
            );
          },
        },
        { title: 'Utilisation', dataIndex: 'utilization', width: 130, render: (_v, r) => <UtilisationBar value={r.utilization} width={64} /> },
        { title: 'Verdict', dataIndex: 'pass', width: 72, render: (_v, r) => <VerdictTag verdict={r.pass ? 'pass' : 'fail'} /> },
        {
          title: 'I required',
          dataIndex: 'requiredI',
          width: 115,
          align: 'right',
          render: (_v, r) => (
            <Quantity si={r.requiredI} quantity="inertia" system={system} style={r.pass ? { color: '#6b7a85' } : { fontWeight: 600 }} />
          ),
        },
        {
          title: '',
          key: 'open',
          width: 125,
          render: (_v, r) => (
            <Button
              size="small"
              type={resultKey(r) === selected ? 'primary' : 'default'}
              aria-pressed={resultKey(r) === selected}
              aria-label={`Contributions of ${r.checkName}, ${segmentName({ kind: r.segmentKind, from: r.segmentFrom }, r.segmentIndex, segments)}`}
              onClick={() => onSelect(r)}
            >
              Contributions
            </Button>
          ),
        },
      ]}
    />
  );
}
