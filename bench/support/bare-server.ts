/**
 * The bare side of the api's side-by-side runs: a plain Express 5 app in its own process that
 * answers the same paths with the same bytes the real api gave (recorded once before the
 * run), with no session, no database, no validation. Bodies of PUT/POST requests are parsed
 * with express.json, as any Express handler taking JSON would. Started by the api suite:
 *   node --import tsx bench/support/bare-server.ts <routes.json>
 * prints `listening <port>` and serves on 127.0.0.1 until killed.
 */
import express from 'express';
import { readFileSync } from 'node:fs';

export interface BareRoute {
  method: 'get' | 'put' | 'post';
  path: string;
  status: number;
  contentType: string;
  body: string;
}

const routes = JSON.parse(readFileSync(process.argv[2]!, 'utf8')) as BareRoute[];
const app = express();
app.disable('x-powered-by');
app.use(express.json({ limit: '50mb' }));
for (const r of routes) {
  const bytes = Buffer.from(r.body);
  app[r.method](r.path, (_req, res) => {
    res.status(r.status).type(r.contentType).send(bytes);
  });
}
const server = app.listen(0, '127.0.0.1', () => {
  const address = server.address();
  console.log(`listening ${typeof address === 'object' && address ? address.port : 0}`);
});
