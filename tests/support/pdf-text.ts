import { PDFParse } from 'pdf-parse';

/** The text of a PDF, read back with pdf-parse (what a reader copying from it would get). */
export async function pdfText(bytes: Uint8Array): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}
