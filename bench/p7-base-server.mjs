// P7-base: the physical baseline for P7 — a bare node:http server that checks the session
// cookie in PostgreSQL (one indexed query on the same `sessions` table, by its primary key) and
// answers with the same pre-compressed round bytes. Run in its own process by bench/p7-load.ts.
import { createHmac, timingSafeEqual } from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import pg from 'pg';

const { DATABASE_URL, SESSION_SECRET, ROUND_GZIP_FILE, PORT } = process.env;
const body = fs.readFileSync(ROUND_GZIP_FILE);
// The same pool size as the server's (server/index.ts).
const pool = new pg.Pool({ connectionString: DATABASE_URL, max: 20 });
pool.on('error', () => {});

/** The session id of a signed `rackside.sid` cookie, as express-session signs it. */
function sessionId(header) {
  const m = /(?:^|;\s*)rackside\.sid=([^;]+)/.exec(header ?? '');
  if (!m) return null;
  const raw = decodeURIComponent(m[1]);
  if (!raw.startsWith('s:')) return null;
  const dot = raw.lastIndexOf('.');
  const sid = raw.slice(2, dot);
  // cookie-signature's scheme: HMAC-SHA256 of the value, base64 without padding.
  const mac = Buffer.from(
    createHmac('sha256', SESSION_SECRET).update(sid).digest('base64').replace(/=+$/, ''),
  );
  const given = Buffer.from(raw.slice(dot + 1));
  return dot > 2 && given.length === mac.length && timingSafeEqual(given, mac) ? sid : null;
}

const server = http.createServer(async (req, res) => {
  try {
    const sid = sessionId(req.headers.cookie);
    const found = sid
      ? await pool.query({
          name: 'session',
          text: 'select 1 from sessions where sid = $1 and expire > now()',
          values: [sid],
        })
      : null;
    if (!found?.rowCount) {
      res.writeHead(401, { 'Content-Type': 'application/json' });
      return res.end('{"error":"signed_out"}');
    }
    res.writeHead(200, {
      'Content-Type': 'application/json',
      'Content-Encoding': 'gzip',
      'Content-Length': body.length,
      'Cache-Control': 'private, no-cache',
    });
    res.end(body);
  } catch {
    res.writeHead(503);
    res.end();
  }
});
server.listen(Number(PORT), '127.0.0.1', () => process.send?.('listening'));
process.on('SIGTERM', () => {
  server.closeAllConnections();
  server.close(() => pool.end().then(() => process.exit(0)));
});
