import { Tag } from 'antd';
import { MOVE_STAGE_LABELS, type MoveStage } from '@amberline/common';

export const STAGE_COLORS: Record<MoveStage, string> = {
  requested: 'blue',
  permits_received: 'cyan',
  escorts_booked: 'purple',
  running: 'gold',
  delivered: 'green',
  cancelled: 'default',
};

export function StageTag({ stage }: { stage: MoveStage }) {
  return (
    <Tag color={STAGE_COLORS[stage]} data-testid="stage-tag" style={{ marginInlineEnd: 0 }}>
      {MOVE_STAGE_LABELS[stage]}
    </Tag>
  );
}
