/**
 * The API tests' PostgreSQL pass: starts a throwaway cluster, runs vitest over tests/api with
 * ARCWRIGHT_TEST_PG_URL set (each test file then makes databases of its own in that cluster), and
 * stops and removes the cluster whatever the outcome. Arguments go to vitest (default: tests/api).
 * Without the PostgreSQL programs it says so loudly and succeeds, so a fresh machine's `npm test` passes.
 */
import { spawn } from 'node:child_process';
import { clusterUnavailableReason, startCluster } from './cluster';

async function main(): Promise<number> {
  const reason = clusterUnavailableReason();
  if (reason) {
    const line = '!'.repeat(100);
    console.warn(`\n${line}\n!! PostgreSQL pass SKIPPED: ${reason}\n!! The API tests ran on SQLite only.\n${line}\n`);
    return 0;
  }
  const started = Date.now();
  const cluster = await startCluster();
  console.log(
    `[postgres pass] cluster up in ${Date.now() - started} ms at ${cluster.adminUrl.replace(/\/[^/]*$/, '')}`,
  );
  const stop = () => cluster.stop();
  process.once('SIGINT', () => (stop(), process.exit(130)));
  process.once('SIGTERM', () => (stop(), process.exit(143)));
  try {
    const args = process.argv.slice(2);
    const vitest = spawn('npx', ['vitest', 'run', ...(args.length ? args : ['tests/api'])], {
      stdio: 'inherit',
      env: { ...process.env, ARCWRIGHT_TEST_PG_URL: cluster.adminUrl },
    });
    return await new Promise<number>((resolve) => vitest.on('exit', (code) => resolve(code ?? 1)));
  } finally {
    stop();
    console.log(`[postgres pass] cluster stopped and removed; ${((Date.now() - started) / 1000).toFixed(1)} s in all`);
  }
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(err instanceof Error ? err.message : err);
    process.exit(1);
  },
);
