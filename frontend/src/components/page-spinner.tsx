import { Spin } from 'antd';

export function PageSpinner() {
  return (
    <div style={{ display: 'grid', placeItems: 'center', minHeight: 240 }}>
      <Spin />
    </div>
  );
}
