import { Alert, Button, Form } from 'antd';

/**
 * The foot of a short form (sign-in, password, invitation): what the last
 * send came to — an error, or a success message — above the submit button.
 * Nothing is shown above the button while there is no outcome.
 */
export function FormFooter({
  problem,
  done,
  submitLabel,
  loading,
  block = false,
}: {
  /** Why the last send was refused (shown as an error). */
  problem?: string | null;
  /** What the last send did (shown as a success), when it did not lead away. */
  done?: string | null;
  submitLabel: string;
  loading: boolean;
  /** The button as wide as the form. */
  block?: boolean;
}) {
  return (
    <>
      {(problem || done) && (
        <Form.Item>{problem ? <Alert type="error" showIcon title={problem} /> : <Alert type="success" showIcon title={done} />}</Form.Item>
      )}
      <Form.Item style={{ marginBottom: 0 }}>
        <Button type="primary" htmlType="submit" block={block} loading={loading}>
          {submitLabel}
        </Button>
      </Form.Item>
    </>
  );
}
