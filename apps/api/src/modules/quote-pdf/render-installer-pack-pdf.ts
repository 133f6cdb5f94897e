import { createElement } from 'react';
import { renderToBuffer, type DocumentProps } from '@react-pdf/renderer';
import type { ReactElement } from 'react';
import { preparePdfFonts } from './fonts';
import { InstallerPackDocument } from './installer-pack-document';
import type { InstallerPackPdfModel } from './installer-pack-model';

/** Lay out and write the installer's pack PDF: plain data in, bytes out (runs in the worker). */
export async function renderInstallerPackPdf(model: InstallerPackPdfModel): Promise<Buffer> {
  await preparePdfFonts();
  const element = createElement(InstallerPackDocument, { model }) as unknown as ReactElement<DocumentProps>;
  return renderToBuffer(element);
}
