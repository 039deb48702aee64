/**
 * The yardstick of `npm run bench:api`, run as its own process: a bare Express 5 route that reads one plan
 * row with a prepared better-sqlite3 statement and sends it as JSON, with nothing else (no session, no
 * headers, no log). Started by `tests/bench/api.bench.ts` with the database file and the owner's id.
 */
import type { AddressInfo } from 'node:net';
import BetterSqlite3 from 'better-sqlite3';
import express from 'express';

const [file, ownerId] = process.argv.slice(2);
if (!file || !ownerId) throw new Error('usage: api-route.ts <database file> <owner id>');

const sqlite = new BetterSqlite3(file, { readonly: true });
const byIdAndOwner = sqlite.prepare('select * from plans where id = ? and owner_id = ?');
const app = express();
app.get('/plans/:id', (req, res) => {
  const row = byIdAndOwner.get(req.params.id, ownerId) as Record<string, unknown> & { document: string };
  res.json({ ...row, document: JSON.parse(row.document) as unknown });
});
const server = app.listen(0, '127.0.0.1', () => {
  const { port } = server.address() as AddressInfo;
  process.send?.({ url: `http://127.0.0.1:${port}` });
});
// The benchmark asks for the CPU time spent, before and after each measured run.
process.on('message', () => process.send?.({ cpu: process.cpuUsage() }));
process.on('disconnect', () => {
  server.close();
  sqlite.close();
});
