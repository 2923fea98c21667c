import type { ReactNode } from 'react';
import { Card } from 'antd';

/** One block of the run sheet: a card that keeps together on paper. */
export function Section({ title, id, extra, children }: { title: ReactNode; id: string; extra?: ReactNode; children: ReactNode }) {
  return (
    <Card
      id={id}
      data-testid={`section-${id}`}
      title={title}
      extra={extra}
      size="small"
      className="run-sheet-section"
      style={{ marginBottom: 12 }}
      styles={{ header: { minHeight: 40 }, body: { padding: 12 } }}
    >
      {children}
    </Card>
  );
}

/** A quiet information box (the theme's info color is a dark slate, too heavy for notes). */
export const INFO_STYLE = { background: '#f1f5f9', borderColor: '#cbd5e1' } as const;
/** A light green for a good outcome (the theme's derived success background is dull on phones). */
export const SUCCESS_STYLE = { background: '#f0fdf4', borderColor: '#86efac' } as const;

/** A label over its value, for short facts on a narrow screen. */
export function Fact({ label, children, testId }: { label: string; children: ReactNode; testId?: string }) {
  return (
    <div style={{ minWidth: 0 }} data-testid={testId}>
      <div style={{ fontSize: 12, color: '#64748b' }}>{label}</div>
      <div style={{ fontWeight: 500, overflowWrap: 'anywhere' }}>{children}</div>
    </div>
  );
}

/** Facts in two columns on a phone, more on a wider screen. */
export function Facts({ children }: { children: ReactNode }) {
  return <div style={{ display: 'grid', gridTemplateColumns: 'repeat(auto-fill, minmax(150px, 1fr))', gap: '8px 16px' }}>{children}</div>;
}
