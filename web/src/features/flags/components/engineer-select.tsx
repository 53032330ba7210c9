import { Select } from 'antd';
import { useEngineers } from '../api/get-engineers';

/**
 * Chooses an engineer of the project (flags are assigned to engineers), or
 * nobody (null, when `allowNone`).
 */
export function EngineerSelect({
  projectId,
  value,
  onChange,
  allowNone = true,
  id,
  'aria-label': ariaLabel,
}: {
  projectId: number;
  value?: number | null;
  onChange?: (v: number | null) => void;
  allowNone?: boolean;
  id?: string;
  'aria-label'?: string;
}) {
  const { engineers, isLoading, error } = useEngineers(projectId);
  const options = [
    ...(allowNone ? [{ value: 0, label: 'Nobody yet' }] : []),
    ...engineers.map((e) => ({
      value: e.userId,
      label: `${e.name || e.email}${e.status === 'invited' ? ' (invited)' : ''}`,
    })),
  ];
  return (
    <Select<number>
      id={id}
      aria-label={ariaLabel}
      value={value === null ? (allowNone ? 0 : undefined) : value}
      onChange={(v) => onChange?.(v === 0 ? null : v)}
      loading={isLoading}
      options={options}
      placeholder="Choose an engineer"
      notFoundContent={error ? 'The team could not be loaded.' : 'No engineer on this project yet (a manager adds one on the Team screen).'}
      showSearch={{ optionFilterProp: 'label' }}
      popupMatchSelectWidth={false}
    />
  );
}
