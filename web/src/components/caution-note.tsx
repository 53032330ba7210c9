import { Typography } from 'antd';

/** The usual caution (product.md): Sagline supports the engineer, it does not decide. */
export const CAUTION_TEXT =
  "Sagline supports checking; it does not replace the engineer of record's judgement or the local building code.";

export function CautionNote() {
  return (
    <Typography.Text type="secondary" style={{ fontSize: 12 }}>
      {CAUTION_TEXT}
    </Typography.Text>
  );
}
