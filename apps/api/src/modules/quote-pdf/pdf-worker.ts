import { parentPort } from 'node:worker_threads';
import type { QuotePdfModel } from './pdf-model';
import { renderQuotePdf } from './render-quote-pdf';

/** The PDF worker thread: renders one model per message, off the api's request thread. */
interface Job {
  id: number;
  model: QuotePdfModel;
}

parentPort?.on('message', (job: Job) => {
  renderQuotePdf(job.model).then(
    (pdf) => parentPort?.postMessage({ id: job.id, pdf }),
    (err: unknown) => parentPort?.postMessage({ id: job.id, error: err instanceof Error ? err.message : String(err) }),
  );
});
