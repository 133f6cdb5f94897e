import { parentPort } from 'node:worker_threads';
import type { PdfJob } from './pdf-renderer';
import { renderInstallerPackPdf } from './render-installer-pack-pdf';
import { renderQuotePdf } from './render-quote-pdf';

/** The PDF worker thread: renders one document per message, off the api's request thread. */
interface Job {
  id: number;
  job: PdfJob;
}

function render(job: PdfJob): Promise<Buffer> {
  return job.document === 'installer-pack' ? renderInstallerPackPdf(job.model) : renderQuotePdf(job.model);
}

parentPort?.on('message', (message: Job) => {
  render(message.job).then(
    (pdf) => parentPort?.postMessage({ id: message.id, pdf }),
    (err: unknown) => parentPort?.postMessage({ id: message.id, error: err instanceof Error ? err.message : String(err) }),
  );
});
