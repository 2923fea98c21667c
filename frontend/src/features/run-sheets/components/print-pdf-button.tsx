import { App, Button } from 'antd';
import { useOpenRunSheetPdf } from '../api/get-run-sheet-pdf';

export function PrintPdfButton({ moveId }: { moveId: string }) {
  const { message } = App.useApp();
  const open = useOpenRunSheetPdf();
  return (
    <Button
      className="no-print"
      loading={open.isPending}
      data-testid="print-pdf"
      onClick={() => open.mutate(moveId, { onError: (e) => message.error(e instanceof Error ? e.message : 'The PDF could not be opened.') })}
    >
      Print PDF
    </Button>
  );
}
