/**
 * `npm run bench:load -- --routes`: four routes of the real server side by side under the same load.
 *
 * Starts the server on a temporary database and a free loopback port, signs up one account, gives it one sketch to
 * read and a pool of sketches to save, then runs autocannon (LOAD_CONNECTIONS connections, LOAD_SECONDS each) on
 * one route after another:
 * - GET /api/health (no session; the floor every other route is compared with),
 * - GET /api/sketches/:id, signed in,
 * - PUT /api/sketches/:id, a save naming the version it edits. A save takes a sketch no other connection is
 *   saving from the pool and puts it back with the version the answer gave, so no save is stale; a conflict would
 *   show as a non-2xx answer, that is an error,
 * - POST /api/sweep with the four-link sketch file.
 * Every request says `Accept-Encoding: gzip, deflate, br`, as browsers do, so compression is measured too.
 * Each route first runs LOAD_WARMUP_SECONDS unrecorded, so that the first route is not the one that pays for the
 * server's warm-up. LOAD_ROUTES=health,read (keys health, read, save, sweep) runs only those, e.g. for a profile
 * (LOAD_PROFILE=<dir> writes a V8 CPU profile of the server there). Prints req/s, p50 and p95 latency, errors (non-2xx answers, socket errors and timeouts) and
 * each route's req/s as a ratio to the health route's. A benchmark: it prints figures and never fails on time; it
 * exits 1 only when a request failed.
 *
 * The sweep limit per address is raised for the run (every connection comes from 127.0.0.1): the figure is the
 * sweep's own cost, not the limiter's 429.
 */
import os from 'node:os';
import autocannon, { type Request as CannonRequest } from 'autocannon';
import { Client, fixtureDocument, startServer, type LoadServer } from './load-server';

const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 50);
const DURATION_S = Number(process.env.LOAD_SECONDS ?? 20);
const WARMUP_S = Number(process.env.LOAD_WARMUP_SECONDS ?? 2);
/** What a browser accepts; LOAD_ENCODING overrides it (an empty value sends no Accept-Encoding). */
const ENCODINGS = process.env.LOAD_ENCODING ?? 'gzip, deflate, br';

interface RouteLoad {
  /** The name LOAD_ROUTES picks it by. */
  key: string;
  label: string;
  requests: CannonRequest[];
}

interface RouteFigures {
  label: string;
  reqPerS: number;
  p50: number;
  p95: number;
  errors: number;
  non2xx: number;
  socketErrors: number;
  timeouts: number;
  /** The server's CPU time per answered request (ms): steadier than req/s on a shared machine. */
  cpuMsPerRequest: number;
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function run(server: LoadServer, route: RouteLoad, seconds: number): Promise<RouteFigures> {
  return new Promise((resolve, reject) => {
    const latencies: number[] = [];
    const cpuBefore = server.cpuMs();
    const instance = autocannon(
      { url: server.base, connections: CONNECTIONS, duration: seconds, requests: route.requests },
      (err, result) => {
        if (err) return reject(err);
        const sorted = latencies.sort((a, b) => a - b);
        resolve({
          label: route.label,
          reqPerS: latencies.length / (result.duration || seconds),
          p50: percentile(sorted, 50),
          p95: percentile(sorted, 95),
          errors: result.non2xx + result.errors,
          non2xx: result.non2xx,
          socketErrors: result.errors - result.timeouts,
          timeouts: result.timeouts,
          cpuMsPerRequest: (server.cpuMs() - cpuBefore) / latencies.length,
        });
      },
    );
    instance.on('response', (_client, _status, _bytes, responseTime: number) => latencies.push(responseTime));
  });
}

interface PooledSketch {
  id: number;
  version: number;
}

/** What one save carries from its request to its answer (autocannon's per-request context). */
interface SaveContext {
  sketch: PooledSketch;
}

/**
 * The sketches of the save route; a connection takes one that no other connection is saving and puts it back with
 * the next version once the save is answered. A save that times out never comes back: when the pool runs dry, the
 * sketch longest in flight is taken again with the version last known, so a save that went through after all shows
 * as a conflict (an error), never as a crash of the benchmark.
 */
class SavePool {
  private free: PooledSketch[] = [];
  private inFlight = new Set<PooledSketch>();
  constructor(sketches: PooledSketch[]) {
    this.free = [...sketches];
  }

  private take(): PooledSketch {
    const sketch = this.free.pop() ?? this.inFlight.values().next().value;
    if (!sketch) throw new Error('the save pool is empty');
    this.inFlight.delete(sketch);
    this.inFlight.add(sketch);
    return sketch;
  }

  request(headers: Record<string, string>, body: Record<string, unknown>): CannonRequest {
    return {
      method: 'PUT',
      headers,
      setupRequest: (req, context) => {
        const sketch = this.take();
        (context as SaveContext).sketch = sketch;
        return {
          ...req,
          path: `/api/sketches/${sketch.id}`,
          body: JSON.stringify({ ...body, version: sketch.version }),
        };
      },
      onResponse: (status, responseBody, context) => {
        // A save makes exactly the next version; the answer itself may be compressed, and autocannon hands it over
        // as text, so it is not read.
        const { sketch } = context as SaveContext;
        this.inFlight.delete(sketch);
        if (status === 200) sketch.version += 1;
        // A conflict (counted as an error) names the current version in its small, uncompressed answer.
        if (status === 409)
          sketch.version = (JSON.parse(responseBody) as { details: { version: number } }).details.version;
        this.free.push(sketch);
      },
    };
  }
}

export async function runRouteComparison(): Promise<void> {
  const server = await startServer({ SIGNUP_MAX_PER_ADDRESS: '10', SWEEP_MAX_PER_MINUTE: '100000000' });
  try {
    const document = fixtureDocument();
    const client = new Client(server.base);
    await client.signUp('load-routes@example.test', 'copper-routes-harbour-1', 'Load Routes', server.dbPath);
    const created = await client.call('POST', '/api/sketches', { name: 'Read me', document });
    if (created.status !== 201) throw new Error(`create answered ${created.status}`);
    const readId = created.json.id;
    // Twice the connections, so that a save lost to a timeout never leaves a connection without a sketch.
    const saveSketches: PooledSketch[] = [];
    for (let i = 0; i < CONNECTIONS * 2; i++) {
      const res = await client.call('POST', '/api/sketches', { name: `Save ${i}`, document });
      if (res.status !== 201) throw new Error(`create answered ${res.status}`);
      saveSketches.push({ id: res.json.id, version: res.json.version });
    }
    const pool = new SavePool(saveSketches);
    const barrier = await client.call('POST', '/api/sketches', { name: 'Barrier', document });
    if (barrier.status !== 201) throw new Error(`create answered ${barrier.status}`);
    let barrierVersion = barrier.json.version;
    /**
     * autocannon drops its connections when a route's time is up, but the server still finishes the requests it
     * was given. Before the next route starts, one save and one health check go through after all of them (saves
     * are queued one after another), so that no route pays for the previous one.
     */
    const drain = async () => {
      const saved = await client.call('PUT', `/api/sketches/${barrier.json.id}`, {
        name: 'Barrier',
        document,
        version: barrierVersion,
      });
      if (saved.status !== 200) throw new Error(`the drain save answered ${saved.status}`);
      barrierVersion = saved.json.version;
      await client.call('GET', '/api/health');
    };

    const browser: Record<string, string> = ENCODINGS ? { 'accept-encoding': ENCODINGS } : {};
    const signedIn = { ...browser, cookie: client.cookie };
    const writing = { ...signedIn, 'content-type': 'application/json', 'x-csrf-token': client.token };
    const routes: RouteLoad[] = [
      { key: 'health', label: 'GET /api/health', requests: [{ method: 'GET', path: '/api/health', headers: browser }] },
      {
        key: 'read',
        label: 'GET /api/sketches/:id (signed in)',
        requests: [{ method: 'GET', path: `/api/sketches/${readId}`, headers: signedIn }],
      },
      {
        key: 'save',
        label: 'PUT /api/sketches/:id (save)',
        requests: [pool.request(writing, { name: 'Saved under load', document })],
      },
      {
        key: 'sweep',
        label: 'POST /api/sweep',
        requests: [{ method: 'POST', path: '/api/sweep', headers: writing, body: JSON.stringify(document) }],
      },
    ];

    const started = new Date();
    console.log(
      `${started.toISOString()}: ${CONNECTIONS} connections, ${DURATION_S} s per route (after ${WARMUP_S} s warm-up); ` +
        `load average ${os
          .loadavg()
          .map((l) => l.toFixed(2))
          .join(', ')}; Node ${process.version}, ` +
        `${os.cpus().length} CPUs`,
    );
    const figures: RouteFigures[] = [];
    const picked = process.env.LOAD_ROUTES?.split(',');
    for (const route of routes.filter((r) => !picked || picked.includes(r.key))) {
      if (WARMUP_S > 0) {
        await run(server, route, WARMUP_S);
        await drain();
      }
      const f = await run(server, route, DURATION_S);
      await drain();
      figures.push(f);
      console.log(
        `  ${f.label}: ${f.reqPerS.toFixed(0)} req/s, errors ${f.errors} ` +
          `(non-2xx ${f.non2xx}, socket ${f.socketErrors}, timeouts ${f.timeouts})`,
      );
    }
    const health = figures.find((f) => f.label === routes[0].label)?.reqPerS ?? NaN;
    console.log(
      `\nload average at the end: ${os
        .loadavg()
        .map((l) => l.toFixed(2))
        .join(', ')}\n`,
    );
    console.log('| route | req/s | p50 ms | p95 ms | errors | ratio to health | server CPU ms/request |');
    console.log('| --- | --- | --- | --- | --- | --- | --- |');
    for (const f of figures) {
      console.log(
        `| ${f.label} | ${f.reqPerS.toFixed(0)} | ${f.p50.toFixed(0)} | ${f.p95.toFixed(0)} | ${f.errors} | ` +
          `${(f.reqPerS / health).toFixed(2)}× | ${f.cpuMsPerRequest.toFixed(2)} |`,
      );
    }
    await server.stop();
    server.remove();
    process.exit(figures.some((f) => f.errors > 0) ? 1 : 0);
  } catch (err) {
    console.error('route comparison failed:', err);
    await server.stop();
    process.exit(1);
  }
}
