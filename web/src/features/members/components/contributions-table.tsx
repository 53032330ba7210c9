import type { ReactNode } from 'react';
import { Table, Typography } from 'antd';
import { CheckCircleFilled, ExclamationCircleFilled } from '@ant-design/icons';
import type { MemberDetail, MemberResultView } from '@sagline/common/api-types';
import { formatQuantity, type UnitSystemId } from '@sagline/common/units';
import { palette } from '@/app/theme';
import { unitText } from './member-labels';
import { combinationFormula, deflectionDecimals, loadWords, sameDeflection, segmentName, signedDeflection } from './member-words';

interface ContributionRow {
  key: number;
  /** 1-based, as the loads are numbered in the drawing's order. */
  number: number;
  case: string;
  load: string;
  factor: number;
  /** The load alone (factor 1), m, positive up; null when the factor is 0. */
  alone: number | null;
  contribution: number;
}

/** The check result whose contributions are shown, and what it adds up. */
export function contributionsOf(detail: MemberDetail, result: MemberResultView) {
  const combination =
    detail.report.combinations[result.combination] !== undefined
      ? result.combination
      : detail.report.checks.find((c) => c.name === result.checkName)?.combination ?? result.combination;
  const segment = detail.report.combinations[combination]?.segments[result.segmentIndex];
  if (!segment) return null;
  const rows: ContributionRow[] = segment.contributions.map((c) => ({
    key: c.load,
    number: c.load + 1,
    case: c.case,
    load: loadWords(detail.beamInput.loads[c.load], detail.unitSystem),
    factor: c.factor,
    alone: c.factor !== 0 ? c.deflection / c.factor : null,
    contribution: c.deflection,
  }));
  // Summed in load order, as the table is read.
  const sum = rows.reduce((s, r) => s + r.contribution, 0);
  return { combination, segment, rows, sum };
}

/**
 * Each load's signed share of the deflection at the governing point of one
 * check (the extreme of its segment under the check's combination), summed
 * like a hand calculation; the sum is set against the deflection of the
 * checks table, which must be the same number.
 */
export function ContributionsTable({ detail, result }: { detail: MemberDetail; result: MemberResultView }) {
  const system: UnitSystemId = detail.unitSystem;
  const found = contributionsOf(detail, result);
  if (!found) {
    return <Typography.Text type="secondary">The engine report has no such segment for {result.checkName}.</Typography.Text>;
  }
  const { combination, segment, rows, sum } = found;
  const segments = detail.report.segments;
  const where = segmentName(segments[result.segmentIndex] ?? segment, result.segmentIndex, segments);
  const formula = combinationFormula(detail.beamInput.combinations[combination]);
  const matches = sameDeflection(sum, result.deflection);
  const share = (v: number) => (sum !== 0 ? `${((v / sum) * 100).toFixed(1)} %` : '—');
  // Does adding the printed lines give the printed sum? Not always, after rounding: then say so.
  const decimals = deflectionDecimals(system);
  const inUnit = (m: number) => Number(formatQuantity(m, 'deflection', system, { decimals, unitText: 'none', grouping: false }));
  const printedLines = rows.reduce((s, r) => s + inUnit(r.contribution), 0);
  const roundingShows = Math.abs(printedLines - inUnit(sum)) > 10 ** -decimals / 2;
  const step = `${(10 ** -decimals).toFixed(decimals)} ${unitText('deflection', system)}`;

  return (
    <Table<ContributionRow>
      aria-label="Contributions"
      size="small"
      rowKey="key"
      pagination={false}
      dataSource={rows}
      scroll={{ x: 760 }}
      title={() => (
        <Typography.Text>
          <Typography.Text strong>{result.checkName}</Typography.Text>, {where}: deflection at x ={' '}
          {formatQuantity(segment.extreme.x, 'position', system)} under {combination}
          {formula && !sameFormula(formula, combination) ? ` (${formula})` : ''}. Positive is up; a sagging member is negative.
        </Typography.Text>
      )}
      columns={[
        { title: 'Load', dataIndex: 'number', width: 60, render: (n: number) => `#${n}` },
        { title: 'Case', dataIndex: 'case', width: 60 },
        { title: 'What', dataIndex: 'load', ellipsis: { showTitle: true } },
        {
          title: 'Load alone',
          dataIndex: 'alone',
          width: 120,
          align: 'right',
          render: (v: number | null) => (v === null ? '—' : <Num>{signedDeflection(v, system)}</Num>),
        },
        { title: 'Factor', dataIndex: 'factor', width: 70, align: 'right', render: (f: number) => <Num>{Number(f.toPrecision(6))}</Num> },
        {
          title: 'Contribution',
          dataIndex: 'contribution',
          width: 130,
          align: 'right',
          render: (v: number) => <Num strong>{signedDeflection(v, system)}</Num>,
        },
        { title: 'Share', key: 'share', width: 80, align: 'right', render: (_v, r) => <Num>{share(r.contribution)}</Num> },
      ]}
      summary={() => (
        <Table.Summary>
          <Table.Summary.Row data-testid="contributions-sum">
            <Table.Summary.Cell index={0} colSpan={5}>
              <Typography.Text strong>Sum of the contributions</Typography.Text>
            </Table.Summary.Cell>
            <Table.Summary.Cell index={5} align="right">
              <Num strong>{signedDeflection(sum, system)}</Num>
            </Table.Summary.Cell>
            <Table.Summary.Cell index={6} align="right">
              <Num>{rows.length ? '100.0 %' : '—'}</Num>
            </Table.Summary.Cell>
          </Table.Summary.Row>
          <Table.Summary.Row data-testid="contributions-check">
            <Table.Summary.Cell index={0} colSpan={5}>
              <Typography.Text>
                Checks table, {result.checkName}, {where}
              </Typography.Text>
            </Table.Summary.Cell>
            <Table.Summary.Cell index={5} align="right">
              <Num>{signedDeflection(result.deflection, system)}</Num>
            </Table.Summary.Cell>
            <Table.Summary.Cell index={6} align="right">
              {matches ? (
                <Typography.Text style={{ color: palette.pass, whiteSpace: 'nowrap' }}>
                  <CheckCircleFilled aria-hidden /> equal
                </Typography.Text>
              ) : (
                <Typography.Text type="danger" style={{ whiteSpace: 'nowrap' }}>
                  <ExclamationCircleFilled aria-hidden /> differs
                </Typography.Text>
              )}
            </Table.Summary.Cell>
          </Table.Summary.Row>
          {roundingShows && (
            <Table.Summary.Row>
              <Table.Summary.Cell index={0} colSpan={7}>
                <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                  Each line is rounded to {step}; the sum is of the unrounded values, so the printed lines add up to a
                  slightly different last digit.
                </Typography.Text>
              </Table.Summary.Cell>
            </Table.Summary.Row>
          )}
        </Table.Summary>
      )}
    />
  );
}

/** "1 D + 1 L" says nothing more than a combination named "D+L". */
function sameFormula(formula: string, name: string): boolean {
  const bare = (t: string) => t.replace(/(^|[+\s])1 /g, '$1').replace(/\s+/g, '');
  return bare(formula) === bare(name);
}

function Num({ children, strong }: { children: ReactNode; strong?: boolean }) {
  return <span style={{ fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap', fontWeight: strong ? 600 : undefined }}>{children}</span>;
}
