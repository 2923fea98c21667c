import { Button, Result } from 'antd';
import { Link } from 'react-router-dom';

export function NotFoundPage() {
  return <Result status="404" title="Not here" subTitle="This page does not exist or is not open to your role." extra={<Link to="/"><Button>Back to the overview</Button></Link>} />;
}
