import { Alert } from 'antd';

/** The cautions the driver reads first: measure, the permit and officers govern, clearances, certified scale. */
export function CautionsBox({ cautions }: { cautions: string[] }) {
  return (
    <Alert
      type="warning"
      showIcon
      data-testid="run-sheet-cautions"
      style={{ marginBottom: 12, borderWidth: 2 }}
      title={<strong>Before you leave</strong>}
      description={
        <ul style={{ margin: 0, paddingInlineStart: 18 }}>
          {cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      }
    />
  );
}
