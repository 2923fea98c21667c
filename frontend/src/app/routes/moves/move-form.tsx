import { Alert, Breadcrumb, Spin, Typography } from 'antd';
import { Link, useParams } from 'react-router-dom';
import { useMove } from '../../../features/moves/api/get-move';
import { useTractors } from '../../../features/fleet/api/get-tractors';
import { useTrailers } from '../../../features/fleet/api/get-trailers';
import { MoveForm } from '../../../features/moves/components/move-form/move-form';
import { paths, to } from '../../../config/paths';

/** /moves/new and /moves/:id/edit: the move form in steps with live feedback. */
export function MoveFormPage() {
  const { id } = useParams();
  const move = useMove(id);
  const tractors = useTractors();
  const trailers = useTrailers();
  if (id && move.isPending) return <Spin style={{ display: 'block', margin: 48 }} />;
  if (id && move.isError) return <Alert type="error" showIcon title={move.error.message} />;
  const m = id ? move.data : undefined;
  const closed = m && (m.stage === 'delivered' || m.stage === 'cancelled');
  return (
    <div>
      <Breadcrumb
        style={{ marginBottom: 8 }}
        items={[{ title: <Link to={paths.moves}>Moves</Link> }, ...(m ? [{ title: <Link to={to.move(m.id)}>{m.reference}</Link> }] : []), { title: m ? 'Edit' : 'New move' }]}
      />
      <Typography.Title level={2} style={{ marginTop: 0 }}>
        {m ? `Edit ${m.reference}` : 'New move'}
      </Typography.Title>
      {closed ? <Alert type="info" showIcon title={`A ${m.stage} move cannot be edited.`} /> : <MoveForm move={m} tractors={tractors} trailers={trailers} />}
    </div>
  );
}
