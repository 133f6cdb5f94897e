import { createElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import type { ReactElement } from 'react';
import { preparePdfFonts } from './fonts';
import type { QuotePdfModel } from './pdf-model';
import { QuoteDocument } from './quote-document';

/**
 * Lay out and write the quote PDF. Pure with respect to the app: plain data in, bytes out,
 * no ORM and no request, so it runs in the worker thread (pdf-worker.ts) as well as inline.
 */
export async function renderQuotePdf(model: QuotePdfModel): Promise<Buffer> {
  await preparePdfFonts();
  const element = createElement(QuoteDocument, { model }) as unknown as ReactElement<DocumentProps>;
  return renderToBuffer(element);
}
