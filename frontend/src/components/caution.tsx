import { Alert } from 'antd';
import { PLANNING_CAUTION, RULEBOOK_CAUTION } from '@amberline/common';

/** The caution shown wherever weights, securement, clearances or rulebook values appear. */
export function Caution({ kind = 'planning', style }: { kind?: 'planning' | 'rulebook' | 'both'; style?: React.CSSProperties }) {
  const text = kind === 'planning' ? PLANNING_CAUTION : kind === 'rulebook' ? RULEBOOK_CAUTION : `${PLANNING_CAUTION} ${RULEBOOK_CAUTION}`;
  return <Alert type="warning" showIcon title={text} style={{ marginBottom: 12, ...style }} data-testid="caution" />;
}
