import { useState } from 'react';
import { Alert, Button, Form, Input, Radio } from 'antd';
import { LIMITS, UNIT_SYSTEMS, type CreateProjectRequest, type Project, type UnitSystem } from '@sagline/common/api-types';
import { UNIT_SYSTEM_LABEL, UNIT_SYSTEMS as UNIT_SYSTEMS_DISPLAY } from '@sagline/common/units/unit-systems';
import { errorMessage } from '@/app/api-error';
import { showFieldErrors } from '@/lib/form-errors';
import { useCreateProject } from '../api/create-project';
import { DEFAULT_LEVELS, LevelsEditor } from './levels-editor';

// Straight from the unit rules (not the units index, which pulls in decimal.js).
const unitLabel = (u: UnitSystem) => {
  const d = UNIT_SYSTEMS_DISPLAY[u];
  return `${UNIT_SYSTEM_LABEL[u]}: ${d.span}, ${d.deflection}, ${d.force}, ${d.lineLoad}`;
};

export function NewProjectForm({ onCreated, onCancel }: { onCreated: (p: Project) => void; onCancel: () => void }) {
  const [form] = Form.useForm<CreateProjectRequest>();
  const { trigger, isMutating } = useCreateProject();
  const [problem, setProblem] = useState<string | null>(null);

  const submit = async (values: CreateProjectRequest) => {
    setProblem(null);
    try {
      const project = await trigger({
        name: values.name.trim(),
        number: values.number.trim(),
        unitSystem: values.unitSystem,
        levels: values.levels.map((l) => l.trim()),
      });
      onCreated(project);
    } catch (e) {
      if (!showFieldErrors(form, e, ['name', 'number', 'unitSystem', 'levels'])) setProblem(errorMessage(e));
    }
  };

  return (
    <Form
      form={form}
      layout="vertical"
      requiredMark={false}
      initialValues={{ name: '', number: '', unitSystem: 'SI', levels: DEFAULT_LEVELS }}
      onFinish={submit}
      disabled={isMutating}
    >
      <Form.Item
        label="Project name"
        name="name"
        rules={[
          { required: true, whitespace: true, message: 'Name the project.' },
          { max: LIMITS.projectNameMax, message: `A project name has at most ${LIMITS.projectNameMax} characters.` },
        ]}
      >
        <Input placeholder="e.g. Halvercote Yard" />
      </Form.Item>
      <Form.Item
        label="Project number"
        name="number"
        rules={[
          { required: true, whitespace: true, message: 'Give the project number your firm uses.' },
          { max: LIMITS.projectNumberMax, message: `A project number has at most ${LIMITS.projectNumberMax} characters.` },
        ]}
      >
        <Input placeholder="e.g. HY-2041" style={{ maxWidth: 240 }} />
      </Form.Item>
      <Form.Item label="Unit system" name="unitSystem" extra="Schedules are read and results shown in these units.">
        <Radio.Group
          optionType="button"
          options={UNIT_SYSTEMS.map((u) => ({ value: u, label: unitLabel(u) }))}
        />
      </Form.Item>
      <Form.Item label="Levels" required>
        <LevelsEditor name="levels" />
      </Form.Item>
      {problem && (
        <Form.Item>
          <Alert type="error" showIcon title={problem} />
        </Form.Item>
      )}
      <Form.Item style={{ marginBottom: 0, textAlign: 'right' }}>
        <Button onClick={onCancel} style={{ marginRight: 8 }}>
          Cancel
        </Button>
        <Button type="primary" htmlType="submit" loading={isMutating}>
          Create project
        </Button>
      </Form.Item>
    </Form>
  );
}
