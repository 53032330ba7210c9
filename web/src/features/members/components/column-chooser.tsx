import { Button, Checkbox, Flex, Popover, Typography } from 'antd';
import { SettingOutlined } from '@ant-design/icons';
import { DEFAULT_COLUMNS, MEMBER_COLUMNS, type MemberColumnKey } from './member-columns';

/** Which columns the Members table shows (Mark always). */
export function ColumnChooser({ value, onChange }: { value: MemberColumnKey[]; onChange: (keys: readonly string[]) => void }) {
  const content = (
    <Flex vertical gap={8} style={{ width: 200 }}>
      <Checkbox.Group
        aria-label="Columns shown"
        value={value}
        onChange={(keys) => onChange(keys as string[])}
        style={{ display: 'flex', flexDirection: 'column', gap: 4 }}
        options={MEMBER_COLUMNS.map((c) => ({ value: c.key, label: c.label, disabled: 'fixed' in c && c.fixed }))}
      />
      <Flex justify="space-between" align="center">
        <Typography.Text type="secondary" style={{ fontSize: 12 }}>
          Kept in this browser.
        </Typography.Text>
        <Button size="small" type="link" onClick={() => onChange(DEFAULT_COLUMNS)}>
          Reset
        </Button>
      </Flex>
    </Flex>
  );
  return (
    <Popover content={content} title="Columns" trigger="click" placement="bottomRight">
      <Button icon={<SettingOutlined />}>Columns</Button>
    </Popover>
  );
}
