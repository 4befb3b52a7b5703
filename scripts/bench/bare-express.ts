// The bare Express endpoint the rounds list is measured against: GET /api/cases answers a fixed
// JSON body (the bench saves a real rounds page to BENCH_BODY_FILE, so both answers are the same
// size), serialised on every request like res.json does for the real one. No session, no
// database. Tells the bench its port over IPC.
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import express from 'express';

const file = process.env.BENCH_BODY_FILE;
if (!file) throw new Error('BENCH_BODY_FILE is not set.');
const body: unknown = JSON.parse(fs.readFileSync(file, 'utf8'));

const app = express();
app.disable('x-powered-by');
app.get('/api/cases', (_req, res) => {
  res.json(body);
});
const server = app.listen(0, '127.0.0.1', () => {
  const { port } = server.address() as AddressInfo;
  process.send?.({ type: 'listening', url: `http://127.0.0.1:${port}`, port });
});
server.keepAliveTimeout = 65_000;
const stop = () => server.close(() => process.exit(0));
process.once('SIGTERM', stop);
process.once('SIGINT', stop);
