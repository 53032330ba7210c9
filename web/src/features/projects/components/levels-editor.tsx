import { Button, Flex, Form, Input, Space, Tooltip, Typography } from 'antd';
import { ArrowDownOutlined, ArrowUpOutlined, DeleteOutlined, PlusOutlined } from '@ant-design/icons';
import { LIMITS } from '@sagline/common/api-types';

/** New projects start with the levels of a typical five-storey frame plus roof. */
export const DEFAULT_LEVELS = ['L1', 'L2', 'L3', 'L4', 'L5', 'Roof'];

/**
 * An editable, ordered list of level names bound to the form field `name`.
 * The value is lowest first (as the API wants); it is drawn top first, like a
 * building section, so "up" on screen is up in the building. Names are required, at most LIMITS.levelNameMax long, and
 * unique ignoring case, because members are matched to levels by name.
 */
export function LevelsEditor({ name }: { name: string }) {
  return (
    <Form.List
      name={name}
      rules={[
        {
          validator: async (_rule, levels: string[] | undefined) => {
            if (!levels || levels.length === 0) throw new Error('A project needs at least one level.');
            if (levels.length > LIMITS.levelsMax) throw new Error(`A project has at most ${LIMITS.levelsMax} levels.`);
          },
        },
      ]}
    >
      {(fields, { add, remove, move }, { errors }) => (
        <Flex vertical gap={0}>
          <Button
            type="dashed"
            icon={<PlusOutlined />}
            onClick={() => add('', fields.length)}
            disabled={fields.length >= LIMITS.levelsMax}
            style={{ marginLeft: 32, marginBottom: 8, width: 'calc(100% - 32px - 104px)' }}
          >
            Add a level on top
          </Button>
          {[...fields].reverse().map((field) => {
            const index = field.name;
            return (
            <Flex key={field.key} gap={8} align="start">
              <Typography.Text type="secondary" style={{ width: 24, lineHeight: '32px', textAlign: 'right' }}>
                {index + 1}
              </Typography.Text>
              <Form.Item
                name={field.name}
                style={{ flex: 1, marginBottom: 8 }}
                validateTrigger={['onChange', 'onBlur']}
                rules={[
                  { required: true, whitespace: true, message: 'Name this level or remove it.' },
                  { max: LIMITS.levelNameMax, message: `A level name has at most ${LIMITS.levelNameMax} characters.` },
                  ({ getFieldValue }) => ({
                    validator: async (_r, value: string | undefined) => {
                      const all: string[] = getFieldValue(name) ?? [];
                      const v = value?.trim().toLowerCase();
                      if (v && all.filter((l) => l?.trim().toLowerCase() === v).length > 1) {
                        throw new Error('Two levels have this name; level names must differ.');
                      }
                    },
                  }),
                ]}
              >
                <Input aria-label={`Level ${index + 1} name`} placeholder="Level name" />
              </Form.Item>
              <Space.Compact>
                <Tooltip title="Move up">
                  <Button
                    aria-label={`Move level ${index + 1} up`}
                    icon={<ArrowUpOutlined />}
                    disabled={index === fields.length - 1}
                    onClick={() => move(index, index + 1)}
                  />
                </Tooltip>
                <Tooltip title="Move down">
                  <Button
                    aria-label={`Move level ${index + 1} down`}
                    icon={<ArrowDownOutlined />}
                    disabled={index === 0}
                    onClick={() => move(index, index - 1)}
                  />
                </Tooltip>
                <Tooltip title="Remove">
                  <Button
                    aria-label={`Remove level ${index + 1}`}
                    icon={<DeleteOutlined />}
                    disabled={fields.length === 1}
                    onClick={() => remove(field.name)}
                  />
                </Tooltip>
              </Space.Compact>
            </Flex>
            );
          })}
          <Typography.Text type="secondary" style={{ fontSize: 12, marginLeft: 32 }}>
            Top of the building first; 1 is the lowest level.
          </Typography.Text>
          <Form.ErrorList errors={errors} />
        </Flex>
      )}
    </Form.List>
  );
}
