import { Result } from 'antd';

// Placeholder until this screen lands; replaced by its own work item.
export function RulebookPage() {
  return <Result status="info" title="Not built yet" />;
}
