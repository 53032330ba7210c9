import { useState } from 'react';
import { Alert, Button, Flex, Form, Input, InputNumber, Select, Table, Typography } from 'antd';
import type { ColumnsType } from 'antd/es/table';
import { DeleteOutlined, PlusOutlined } from '@ant-design/icons';
import { LIMIT_SET_LIMITS, type LimitSetRuleInput, type ProjectLimitSetView, type UpdateLimitSetRequest } from '@sagline/common/api-types';
import { MATERIAL_IDS, MEMBER_CATEGORIES } from '@sagline/common/limits';
import { defaultUnit, fromSI, toSI, type UnitSystemId } from '@sagline/common/units';
import { errorMessage, isApiError } from '@/app/api-error';
import { formatCombination, parseCombination } from './combination-text';

/** One rule as the form holds it: the source flattened, the cap in the project's deflection unit. */
export interface RuleValues {
  id?: string;
  category?: string;
  check?: string;
  combination?: string;
  ratio?: number | null;
  maxAbs?: number | null;
  plus?: number | null;
  materials?: string[];
  document?: string;
  edition?: string;
  clause?: string;
  trust?: string;
  note?: string;
}

export interface EditValues {
  name: string;
  description: string;
  rules: RuleValues[];
}

const TRUSTS = ['verified', 'from memory', 'common practice'];

/** The form field a server problem belongs to (`body.rules[2].source.document` → ['rules', 2, 'document']). */
export function fieldOf(path: string | undefined): (string | number)[] | null {
  if (!path) return null;
  const p = path.replace(/^body\./, '');
  if (p === 'name' || p === 'description') return [p];
  const m = /^rules\[(\d+)\]\.(?:source\.)?([A-Za-z]+)/.exec(p);
  if (!m) return null;
  const field = m[2];
  const known = ['category', 'check', 'combination', 'ratio', 'maxAbs', 'plus', 'materials', 'document', 'edition', 'clause', 'trust', 'note'];
  return known.includes(field) ? ['rules', Number(m[1]), field] : null;
}

/**
 * The rules of one of the project's sets, editable: member category, check
 * name, combination, ratio, optional absolute cap and additive allowance
 * (span/n + allowance; both in the project's units), materials, and the
 * source of each rule. Fields the form does not show (a length range,
 * long-term cases) are kept as they were. `onSave` gets the request; when it throws the API's validation
 * error, each problem is put next to its field.
 */
export function RulesEditor({
  set,
  system,
  saving,
  onSave,
  onCancel,
}: {
  set: ProjectLimitSetView;
  system: UnitSystemId;
  saving: boolean;
  onSave: (body: UpdateLimitSetRequest) => Promise<void>;
  onCancel: () => void;
}) {
  const [form] = Form.useForm<EditValues>();
  const [problems, setProblems] = useState<string[]>([]);
  const unit = defaultUnit('deflection', system);
  const original = new Map(set.rules.map((r) => [r.id, r]));
  const categories = [
    ...MEMBER_CATEGORIES.map((c) => ({ value: c.id, label: c.label })),
    ...set.categories.filter((c) => !MEMBER_CATEGORIES.some((m) => m.id === c.id)).map((c) => ({ value: c.id, label: c.label })),
  ];

  const initialValues: EditValues = {
    name: set.name,
    description: set.description,
    rules: set.rules.map((r) => ({
      id: r.id,
      category: r.category,
      check: r.check,
      combination: formatCombination(r.combination),
      ratio: r.ratio,
      maxAbs: r.maxAbs === null ? null : Number(fromSI(r.maxAbs, unit).toPrecision(6)),
      plus: r.plus === null ? null : Number(fromSI(r.plus, unit).toPrecision(6)),
      materials: r.materials ?? [],
      document: r.source.document,
      edition: r.source.edition,
      clause: r.source.clause,
      trust: r.source.trust,
      note: r.source.note ?? '',
    })),
  };

  const toRequest = (v: EditValues): UpdateLimitSetRequest => ({
    version: set.version,
    name: v.name.trim(),
    description: (v.description ?? '').trim(),
    rules: (v.rules ?? []).map((r): LimitSetRuleInput => {
      const was = r.id ? original.get(r.id) : undefined;
      const parsed = parseCombination(r.combination ?? '');
      return {
        ...(r.id ? { id: r.id } : {}),
        category: r.category ?? '',
        check: (r.check ?? '').trim(),
        combination: 'value' in parsed ? parsed.value : {},
        ratio: r.ratio as number,
        maxAbs: r.maxAbs === null || r.maxAbs === undefined ? null : toSI(r.maxAbs, unit),
        plus: r.plus === null || r.plus === undefined ? null : toSI(r.plus, unit),
        materials: r.materials && r.materials.length ? r.materials : null,
        lengthRange: was?.lengthRange ?? null,
        longTermCases: was?.longTermCases ?? null,
        source: {
          document: (r.document ?? '').trim(),
          edition: (r.edition ?? '').trim(),
          clause: (r.clause ?? '').trim(),
          trust: r.trust ?? 'common practice',
          ...(r.note?.trim() ? { note: r.note.trim() } : {}),
        },
      };
    }),
  });

  const submit = async (v: EditValues) => {
    setProblems([]);
    try {
      await onSave(toRequest(v));
    } catch (e) {
      if (isApiError(e) && e.details.length) {
        const placed: { name: (string | number)[]; errors: string[] }[] = [];
        const rest: string[] = [];
        for (const d of e.details) {
          const name = fieldOf(d.path);
          const text = d.message.charAt(0).toUpperCase() + d.message.slice(1);
          if (name) placed.push({ name, errors: [text] });
          else rest.push(d.path ? `${d.path.replace(/^body\./, '')}: ${text}` : text);
        }
        form.setFields(placed as never);
        setProblems(rest.length ? [e.message, ...rest] : [e.message]);
      } else {
        setProblems([errorMessage(e)]);
      }
    }
  };

  const required = (message: string) => [{ required: true, whitespace: true, message }];

  return (
    <Form<EditValues>
      form={form}
      layout="vertical"
      initialValues={initialValues}
      onFinish={(v) => void submit(v)}
      onFinishFailed={() => setProblems(['Some rules need fixing: see the messages under the fields.'])}
      aria-label={`Edit ${set.name}`}
      requiredMark={false}
    >
      <Flex gap={12} wrap>
        <Form.Item
          label="Name"
          name="name"
          style={{ flex: '1 1 280px' }}
          rules={[...required('Give the set a name.'), { max: LIMIT_SET_LIMITS.nameMax, message: `At most ${LIMIT_SET_LIMITS.nameMax} characters.` }]}
        >
          <Input />
        </Form.Item>
        <Form.Item label="Description" name="description" style={{ flex: '2 1 420px' }} rules={[{ max: LIMIT_SET_LIMITS.descriptionMax, message: `At most ${LIMIT_SET_LIMITS.descriptionMax} characters.` }]}>
          <Input />
        </Form.Item>
      </Flex>
      <Form.List name="rules">
        {(fields, { add, remove }) => {
          type Field = (typeof fields)[number];
          /** An optional length in the project's deflection unit (the cap, the allowance): empty is none. */
          const optionalLength = (key: 'maxAbs' | 'plus', title: string, label: string, message: string): ColumnsType<Field>[number] => ({
            title,
            key,
            width: 110,
            render: (_, f) => (
              <Form.Item name={[f.name, key]} style={{ margin: 0 }} rules={[{ type: 'number', min: Number.MIN_VALUE, message }]}>
                <InputNumber aria-label={`${label} of rule ${f.name + 1}`} placeholder="—" style={{ width: '100%' }} />
              </Form.Item>
            ),
          });
          const columns: ColumnsType<Field> = [
            {
              title: 'Member category',
              key: 'category',
              width: 210,
              render: (_, f) => (
                <Form.Item name={[f.name, 'category']} rules={[{ required: true, message: 'Choose the member category.' }]} style={{ margin: 0 }}>
                  <Select options={categories} aria-label={`Category of rule ${f.name + 1}`} popupMatchSelectWidth={false} />
                </Form.Item>
              ),
            },
            {
              title: 'Check',
              key: 'check',
              width: 190,
              render: (_, f) => (
                <Form.Item name={[f.name, 'check']} rules={required('Name the check, e.g. "L/360 live".')} style={{ margin: 0 }}>
                  <Input aria-label={`Check of rule ${f.name + 1}`} />
                </Form.Item>
              ),
            },
            {
              title: 'Combination',
              key: 'combination',
              width: 120,
              render: (_, f) => (
                <Form.Item
                  name={[f.name, 'combination']}
                  style={{ margin: 0 }}
                  rules={[
                    {
                      validator: async (_r, value: string | undefined) => {
                        const parsed = parseCombination(value ?? '');
                        if ('error' in parsed) throw new Error(parsed.error);
                      },
                    },
                  ]}
                >
                  <Input aria-label={`Combination of rule ${f.name + 1}`} placeholder="D+L" />
                </Form.Item>
              ),
            },
            {
              title: 'Ratio (span / n)',
              key: 'ratio',
              width: 130,
              render: (_, f) => (
                <Form.Item
                  name={[f.name, 'ratio']}
                  style={{ margin: 0 }}
                  rules={[
                    { required: true, message: 'Give n of span/n, e.g. 360.' },
                    { type: 'number', min: Number.MIN_VALUE, message: 'The ratio must be above zero.' },
                  ]}
                >
                  <InputNumber aria-label={`Ratio of rule ${f.name + 1}`} prefix="/" style={{ width: '100%' }} />
                </Form.Item>
              ),
            },
            optionalLength('maxAbs', `Cap (${unit})`, 'Cap', 'A cap must be above zero, or left empty.'),
            optionalLength('plus', `Plus (${unit})`, 'Allowance', 'An allowance added to span/n must be above zero, or left empty.'),
            {
              title: 'Materials',
              key: 'materials',
              width: 150,
              render: (_, f) => (
                <Form.Item name={[f.name, 'materials']} style={{ margin: 0 }}>
                  <Select mode="multiple" placeholder="any" options={MATERIAL_IDS.map((m) => ({ value: m, label: m }))} aria-label={`Materials of rule ${f.name + 1}`} />
                </Form.Item>
              ),
            },
            {
              title: 'Source (document, edition, table or clause, trust, note)',
              key: 'source',
              width: 330,
              render: (_, f) => (
                <Flex vertical gap={4}>
                  <Form.Item name={[f.name, 'document']} rules={required('Name the document the limit comes from.')} style={{ margin: 0 }}>
                    <Input placeholder="Document" aria-label={`Source document of rule ${f.name + 1}`} />
                  </Form.Item>
                  <Flex gap={4}>
                    <Form.Item name={[f.name, 'edition']} rules={required('Give the edition.')} style={{ margin: 0, flex: '0 0 90px' }}>
                      <Input placeholder="Edition" aria-label={`Source edition of rule ${f.name + 1}`} />
                    </Form.Item>
                    <Form.Item name={[f.name, 'clause']} rules={required('Give the table or clause.')} style={{ margin: 0, flex: 1 }}>
                      <Input placeholder="Table or clause" aria-label={`Source clause of rule ${f.name + 1}`} />
                    </Form.Item>
                  </Flex>
                  <Flex gap={4}>
                    <Form.Item name={[f.name, 'trust']} style={{ margin: 0, flex: '0 0 140px' }} rules={[{ required: true, message: 'Say how far it was checked.' }]}>
                      <Select options={TRUSTS.map((t) => ({ value: t, label: t }))} aria-label={`Trust of rule ${f.name + 1}`} />
                    </Form.Item>
                    <Form.Item name={[f.name, 'note']} style={{ margin: 0, flex: 1 }} rules={[{ max: LIMIT_SET_LIMITS.noteMax, message: `At most ${LIMIT_SET_LIMITS.noteMax} characters.` }]}>
                      <Input placeholder="Note (optional)" aria-label={`Source note of rule ${f.name + 1}`} />
                    </Form.Item>
                  </Flex>
                </Flex>
              ),
            },
            {
              title: '',
              key: 'remove',
              width: 48,
              render: (_, f) => (
                <>
                  {/* The rule's id travels with it, so the server keeps what the form does not show. */}
                  <Form.Item name={[f.name, 'id']} hidden noStyle>
                    <Input />
                  </Form.Item>
                  <Button type="text" danger icon={<DeleteOutlined />} aria-label={`Remove rule ${f.name + 1}`} onClick={() => remove(f.name)} />
                </>
              ),
            },
          ];
          return (
            <Flex vertical gap={8}>
              <Table
                aria-label="Rules being edited"
                size="small"
                rowKey="key"
                columns={columns}
                dataSource={fields}
                pagination={false}
                scroll={{ x: 1300 }}
                locale={{ emptyText: 'No rules: add the first one.' }}
              />
              <div>
                <Button
                  icon={<PlusOutlined />}
                  onClick={() => add({ category: set.categories[0]?.id ?? 'floor', check: '', combination: 'L', ratio: 360, maxAbs: null, plus: null, materials: [], document: '', edition: '', clause: '', trust: 'common practice', note: '' })}
                >
                  Add rule
                </Button>
              </div>
            </Flex>
          );
        }}
      </Form.List>
      {problems.length > 0 && (
        <Alert
          type="error"
          showIcon
          style={{ marginTop: 12 }}
          title="The set was not saved"
          description={
            problems.length === 1 ? problems[0] : (
              <ul style={{ margin: 0, paddingInlineStart: 18 }}>
                {problems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            )
          }
        />
      )}
      <Flex gap={8} justify="flex-end" style={{ marginTop: 12 }}>
        <Button onClick={onCancel} disabled={saving}>
          Cancel
        </Button>
        <Button type="primary" htmlType="submit" loading={saving}>
          {set.active ? 'Save and recompute' : 'Save'}
        </Button>
      </Flex>
      <Typography.Text type="secondary" style={{ fontSize: 12 }}>
        Caps are in {unit}. Allowances, length ranges and long-term factors of copied rules are kept as they were.
      </Typography.Text>
    </Form>
  );
}
