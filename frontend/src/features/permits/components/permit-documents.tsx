/** A permit's attached state documents: the list, downloads, and the upload of the state's PDF. */
import { useState } from 'react';
import { Alert, App, Button, Progress, Table, Upload } from 'antd';
import type { PermitDto } from '@amberline/common';
import { downloadPermitDocument } from '../api/download-file';
import { useUploadPermitDocument } from '../api/upload-permit-document';

export function PermitDocuments({ p, canWork }: { p: PermitDto; canWork: boolean }) {
  const { message } = App.useApp();
  const upload = useUploadPermitDocument();
  const [progress, setProgress] = useState<number | null>(null);
  const [error, setError] = useState<string | null>(null);
  return (
    <div data-testid="permit-documents">
      {canWork && (
        <Upload
          accept="application/pdf,.pdf"
          showUploadList={false}
          customRequest={({ file }) => {
            setError(null);
            setProgress(0);
            upload.mutate(
              { permitId: p.id, file: file as File, onProgress: setProgress },
              {
                onSuccess: (d) => {
                  setProgress(null);
                  message.success(`${d.fileName} attached as version ${d.version}`);
                },
                onError: (e) => {
                  setProgress(null);
                  setError(e.message);
                },
              },
            );
          }}
        >
          <Button loading={upload.isPending} data-testid="permit-upload">Attach permit PDF</Button>
        </Upload>
      )}
      {progress !== null && <Progress percent={progress} size="small" data-testid="upload-progress" />}
      {error && <Alert type="error" showIcon title={error} style={{ marginTop: 8 }} data-testid="upload-error" />}
      <Table
        size="small"
        rowKey="id"
        style={{ marginTop: 8 }}
        pagination={false}
        dataSource={p.documents}
        locale={{ emptyText: 'No PDF yet' }}
        columns={[
          { title: 'Version', dataIndex: 'version', width: 70 },
          { title: 'File', dataIndex: 'fileName', render: (name: string, d) => <Button type="link" size="small" onClick={() => downloadPermitDocument(p.id, d.id, name).catch((e: Error) => message.error(e.message))}>{name}</Button> },
          { title: 'Size', dataIndex: 'sizeBytes', render: (b: number) => `${(b / 1024).toFixed(1)} KB` },
          { title: 'Uploaded', dataIndex: 'uploadedAt', render: (v: string, d) => `${new Date(v).toLocaleString()}${d.uploadedBy ? ` · ${d.uploadedBy.name}` : ''}` },
        ]}
      />
    </div>
  );
}
