/** Reads a PDF the way a person would check it: its text (pdf-parse) and the fonts embedded in it (pdf-lib). */
import { PDFDict, PDFDocument, PDFName } from 'pdf-lib';
// the library entry, not the package index (whose self-test reads a sample file when loaded without a parent module)
// eslint-disable-next-line @typescript-eslint/no-require-imports
const pdfParse: (data: Buffer) => Promise<{ text: string }> = require('pdf-parse/lib/pdf-parse.js');

export async function pdfText(pdf: Buffer): Promise<string> {
  return (await pdfParse(pdf)).text;
}

/** Base names of the fonts whose program is embedded in the file (e.g. `ABCDEF+NotoSans-Regular`). */
export async function embeddedFonts(pdf: Buffer): Promise<string[]> {
  const doc = await PDFDocument.load(pdf);
  const names: string[] = [];
  for (const [, obj] of doc.context.enumerateIndirectObjects()) {
    if (!(obj instanceof PDFDict) || obj.get(PDFName.of('Type')) !== PDFName.of('FontDescriptor')) continue;
    const embedded = ['FontFile', 'FontFile2', 'FontFile3'].some((k) => obj.get(PDFName.of(k)) !== undefined);
    const name = obj.get(PDFName.of('FontName'));
    if (embedded && name) names.push(name.toString().replace(/^\//, ''));
  }
  return names;
}
