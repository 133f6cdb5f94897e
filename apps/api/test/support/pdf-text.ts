/**
 * Reading a rendered PDF back in tests (pdf-parse), and collecting a binary response body
 * with supertest (`.buffer(true).parse(binary)`).
 */
import { PDFParse } from 'pdf-parse';

async function parsed<T>(bytes: Buffer, read: (text: Awaited<ReturnType<PDFParse['getText']>>) => T): Promise<T> {
  const parser = new PDFParse({ data: new Uint8Array(bytes) });
  try {
    return read(await parser.getText());
  } finally {
    await parser.destroy();
  }
}

/** The whole text of a PDF. */
export function pdfText(bytes: Buffer): Promise<string> {
  return parsed(bytes, (t) => t.text);
}

/** The text of each page, in order; with `squeeze`, runs of white space as one space, trimmed. */
export function pdfPages(bytes: Buffer, options: { squeeze?: boolean } = {}): Promise<string[]> {
  return parsed(bytes, (t) => t.pages.map((p) => (options.squeeze ? p.text.replace(/\s+/g, ' ').trim() : p.text)));
}

/** supertest parser that keeps a response body as bytes. */
export function binary(res: { on: (e: string, cb: (c?: Buffer) => void) => void }, cb: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c) => chunks.push(c!));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}
