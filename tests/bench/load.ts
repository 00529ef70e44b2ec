/**
 * Loopback load test of the sketches API (npm run bench:load).
 *
 * Starts the real server (tests/bench/load-server.ts) on a temporary database and a free port,
 * signs up CLIENTS accounts, gives each its own sketch, then lets every client save its sketch
 * over and over for DURATION_S seconds, each save naming the version it edits. Afterwards it
 * checks that no request failed and that every acknowledged save is in the database as a
 * revision with the exact name that save sent. Prints requests per second and latency
 * percentiles. Exits 1 on any error or missing save.
 *
 * Settings: LOAD_CLIENTS (50), LOAD_SECONDS (20), LOAD_PROFILE=<dir> to write a V8 CPU profile
 * of the server there.
 *
 * `npm run bench:load -- --routes` compares four routes side by side instead (tests/bench/load-routes.ts).
 */
import sqlite3 from 'sqlite3';
import { Client, fixtureDocument, startServer } from './load-server';
import { runRouteComparison } from './load-routes';

const CLIENTS = Number(process.env.LOAD_CLIENTS ?? 50);
const DURATION_S = Number(process.env.LOAD_SECONDS ?? 20);

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function queryAll<T>(db: sqlite3.Database, sql: string, params: unknown[] = []): Promise<T[]> {
  return new Promise((resolve, reject) =>
    db.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))),
  );
}

async function main() {
  const server = await startServer({ SIGNUP_MAX_PER_ADDRESS: String(CLIENTS * 2) });
  const { base, dbPath } = server;
  try {
    const document = fixtureDocument();

    const clients: { c: Client; id: number; version: number; acked: { version: number; name: string }[] }[] = [];
    for (let i = 0; i < CLIENTS; i++) {
      const c = new Client(base);
      await c.signUp(`load-${i}@example.test`, `copper-load-harbour-${i}`, `Load ${i}`, dbPath);
      const created = await c.call('POST', '/api/sketches', { name: `Load ${i} v1`, document });
      if (created.status !== 201) throw new Error(`create ${i} answered ${created.status}`);
      clients.push({ c, id: created.json.id, version: created.json.version, acked: [] });
    }
    console.log(`${CLIENTS} clients signed up, each with a sketch; saving for ${DURATION_S} s ...`);

    const latencies: number[] = [];
    const errors: string[] = [];
    const started = performance.now();
    const deadline = started + DURATION_S * 1000;
    await Promise.all(
      clients.map(async (cl, i) => {
        while (performance.now() < deadline) {
          const name = `Load ${i} v${cl.version + 1}`;
          const t0 = performance.now();
          let res;
          try {
            res = await cl.c.call('PUT', `/api/sketches/${cl.id}`, { document, name, version: cl.version });
          } catch (err) {
            errors.push(`client ${i}: ${(err as Error).message}`);
            continue;
          }
          latencies.push(performance.now() - t0);
          if (res.status !== 200) {
            errors.push(`client ${i}: ${res.status} ${JSON.stringify(res.json)}`);
            continue;
          }
          cl.version = res.json.version;
          cl.acked.push({ version: res.json.version, name });
        }
      }),
    );
    const elapsedS = (performance.now() - started) / 1000;

    await server.stop();

    // Every acknowledged save must be a revision with that version and name.
    const db = new sqlite3.Database(dbPath, sqlite3.OPEN_READONLY);
    const revisions = await queryAll<{ sketchId: number; version: number; name: string }>(
      db,
      'SELECT sketchId, version, name FROM sketch_revisions',
    );
    const sketches = await queryAll<{ id: number; version: number; name: string }>(
      db,
      'SELECT id, version, name FROM sketches',
    );
    db.close();
    const have = new Set(revisions.map((r) => `${r.sketchId}/${r.version}/${r.name}`));
    const current = new Map(sketches.map((s) => [s.id, s]));
    let missing = 0;
    let acked = 0;
    for (const cl of clients) {
      for (const a of cl.acked) {
        acked += 1;
        if (!have.has(`${cl.id}/${a.version}/${a.name}`)) missing += 1;
      }
      const last = cl.acked.at(-1);
      const row = current.get(cl.id);
      if (last && (!row || row.version !== last.version || row.name !== last.name)) missing += 1;
    }

    const sorted = [...latencies].sort((a, b) => a - b);
    console.log(
      `requests: ${latencies.length} in ${elapsedS.toFixed(1)} s = ${(latencies.length / elapsedS).toFixed(0)} req/s`,
    );
    console.log(
      `latency ms: p50 ${percentile(sorted, 50).toFixed(1)}, p95 ${percentile(sorted, 95).toFixed(1)}, ` +
        `p99 ${percentile(sorted, 99).toFixed(1)}, max ${sorted.at(-1)?.toFixed(1)}`,
    );
    console.log(
      `acknowledged saves: ${acked}; missing from the database: ${missing}; failed requests: ${errors.length}`,
    );
    if (errors.length) console.log('first errors:', errors.slice(0, 5));
    server.remove();
    process.exit(errors.length || missing || !acked ? 1 : 0);
  } catch (err) {
    console.error('load test failed:', err);
    await server.stop();
    process.exit(1);
  }
}

if (process.argv.includes('--routes')) void runRouteComparison();
else void main();
