/** Step 1: the customer, their reference, the commodity and notes. */
import { Form, Input } from 'antd';
import { stepStyle } from './options';

export function CustomerStep({ hidden }: { hidden: boolean }) {
  return (
        <div style={stepStyle(hidden)}>
          <Form.Item name="customer" label="Customer" rules={[{ required: true, whitespace: true, message: 'Name the customer' }, { max: 120 }]}>
            <Input data-testid="f-customer" />
          </Form.Item>
          <Form.Item name="customerRef" label="Customer's reference" rules={[{ max: 60 }]}>
            <Input placeholder="PO or job number" />
          </Form.Item>
          <Form.Item name="commodity" label="Commodity" rules={[{ required: true, whitespace: true, message: 'Say what is hauled' }, { max: 200 }]}>
            <Input data-testid="f-commodity" />
          </Form.Item>
          <Form.Item name="notes" label="Notes" rules={[{ max: 2000 }]}>
            <Input.TextArea rows={3} />
          </Form.Item>
        </div>
  );
}
