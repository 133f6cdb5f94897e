import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { InstallerPackPdfModel } from './installer-pack-model';
import type { QuotePdfModel } from './pdf-model';

/** A document for the worker: the homeowner's quote or the installer's pack. */
export type PdfJob = { document: 'quote'; model: QuotePdfModel } | { document: 'installer-pack'; model: InstallerPackPdfModel };

/** Turns a PDF model into bytes. */
export interface PdfRenderer {
  /** The quote PDF. */
  render(model: QuotePdfModel): Promise<Buffer>;
  /** The installer's pack PDF. */
  renderInstallerPack(model: InstallerPackPdfModel): Promise<Buffer>;
  close(): Promise<void>;
}

type Reply = { id: number; pdf: Uint8Array } | { id: number; error: string };

/**
 * Renders in one worker thread so a long layout never blocks requests. Started on first use;
 * unref'd so it never keeps the process alive. From the sources (tests, `npm run dev`) the
 * worker loads its TypeScript through tsx; from the bundle it loads dist/pdf-worker.js.
 */
export function createWorkerPdfRenderer(): PdfRenderer {
  let worker: Worker | null = null;
  let next = 1;
  const pending = new Map<number, { resolve: (b: Buffer) => void; reject: (e: Error) => void }>();

  const failAll = (err: Error) => {
    for (const p of pending.values()) p.reject(err);
    pending.clear();
    worker = null;
  };

  function start(): Worker {
    const fromSource = import.meta.url.endsWith('.ts');
    // React's production build whatever the server's NODE_ENV (`npm start` runs with
    // development): the worker has its own module graph, and the development build's checks
    // cost about a tenth of a long render. Nothing in the worker is interactive to warn about.
    const env = { ...process.env, NODE_ENV: 'production' };
    const w = fromSource
      ? // Node 20 workers ignore --import loaders: load tsx's API in the worker, then the module,
        // compiled with the api's tsconfig (JSX) wherever the process was started from
        new Worker(
          `import('tsx/esm/api').then((tsx) => tsx.tsImport(${JSON.stringify(new URL('./pdf-worker.ts', import.meta.url).href)}, ${JSON.stringify({ parentURL: import.meta.url, tsconfig: fileURLToPath(new URL('../../../tsconfig.json', import.meta.url)) })}))`,
          { eval: true, env },
        )
      : new Worker(new URL('./pdf-worker.js', import.meta.url), { env });
    w.unref();
    w.on('message', (reply: Reply) => {
      const p = pending.get(reply.id);
      if (!p) return;
      pending.delete(reply.id);
      if ('error' in reply) p.reject(new Error(`The PDF could not be rendered: ${reply.error}`));
      else p.resolve(Buffer.from(reply.pdf.buffer, reply.pdf.byteOffset, reply.pdf.byteLength));
    });
    w.on('error', (err) => failAll(err));
    w.on('exit', (code) => failAll(new Error(`The PDF worker stopped (exit ${code}).`)));
    return w;
  }

  const send = (job: PdfJob): Promise<Buffer> => {
    worker ??= start();
    const id = next++;
    const w = worker;
    return new Promise<Buffer>((resolve, reject) => {
      pending.set(id, { resolve, reject });
      w.postMessage({ id, job });
    });
  };

  return {
    render: (model) => send({ document: 'quote', model }),
    renderInstallerPack: (model) => send({ document: 'installer-pack', model }),
    async close() {
      const w = worker;
      worker = null;
      if (w) await w.terminate();
    },
  };
}

let shared: PdfRenderer | null = null;

/** The process's PDF worker (one thread: two cores are shared with the api and SQLite). */
export function sharedPdfRenderer(): PdfRenderer {
  shared ??= createWorkerPdfRenderer();
  return shared;
}
