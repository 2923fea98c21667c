import { Space, Tag, Tooltip } from 'antd';
import type { MoveSummaryDto } from '@amberline/common';

/** What a move needs, at a glance: permits, escorts, superload, overweight, open problems. */
export function MoveFlags({ flags }: { flags: MoveSummaryDto['flags'] }) {
  const none = !flags.permitsNeeded && !flags.escorts && !flags.superload && !flags.overweight && !flags.problems;
  return (
    <Space size={[4, 4]} wrap data-testid="move-flags">
      {flags.permitsNeeded > 0 && <Tag color="blue">{flags.permitsNeeded} permit{flags.permitsNeeded === 1 ? '' : 's'}</Tag>}
      {flags.escorts > 0 && <Tag color="purple">{flags.escorts} escort{flags.escorts === 1 ? '' : 's'}</Tag>}
      {flags.superload && <Tag color="magenta">superload</Tag>}
      {flags.overweight && <Tag color="orange">overweight</Tag>}
      {flags.problems > 0 && (
        <Tooltip title="Open the move to see what needs attention">
          <Tag color="red">{flags.problems} problem{flags.problems === 1 ? '' : 's'}</Tag>
        </Tooltip>
      )}
      {none && <Tag>legal load</Tag>}
    </Space>
  );
}
