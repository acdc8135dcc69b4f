// npm test, after bootstrap.sh: type checks, vitest (shared, server, fakes), Karma (components) and end-to-end
// tests in Chromium, then one line `N passed, N failed` over all of them. Exits non-zero when anything failed.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { ensureBuild } from './stack/build';
import { ensureCluster, repoRoot } from './stack/postgres';

interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}
interface Suite {
  name: string;
  counts: Counts;
  ok: boolean;
}

const log = (line: string) => console.log(`keyloom: ${line}`);
const resultsDir = join(repoRoot, '.keyloom/results');
rmSync(resultsDir, { recursive: true, force: true });
mkdirSync(resultsDir, { recursive: true });
const bin = (name: string) => join(repoRoot, 'node_modules/.bin', name);
const suites: Suite[] = [];

function run(command: string, args: string[], env: Record<string, string> = {}): boolean {
  const result = spawnSync(command, args, {
    cwd: repoRoot,
    stdio: 'inherit',
    env: { ...process.env, ...env },
  });
  return result.status === 0;
}

function vitestCounts(file: string): Counts | undefined {
  if (!existsSync(file)) return undefined;
  const report = JSON.parse(readFileSync(file, 'utf8'));
  return {
    passed: report.numPassedTests,
    failed:
      report.numFailedTests +
      (report.numTotalTestSuites > 0 && report.success === false && report.numFailedTests === 0
        ? 1
        : 0),
    skipped: report.numPendingTests + report.numTodoTests,
  };
}

/** A step that is not a test suite of its own still counts: one check that passed or failed. */
function check(name: string, ok: boolean): void {
  suites.push({ name, ok, counts: { passed: ok ? 1 : 0, failed: ok ? 0 : 1, skipped: 0 } });
}

function vitest(name: string, config: string): void {
  const output = join(resultsDir, `${name}.json`);
  const ok = run(bin('vitest'), [
    'run',
    '--config',
    config,
    '--reporter=default',
    '--reporter=json',
    `--outputFile.json=${output}`,
  ]);
  const counts = vitestCounts(output) ?? { passed: 0, failed: 1, skipped: 0 };
  suites.push({ name, ok: ok && counts.failed === 0, counts });
}

// Another checkout's `npm start` may hold the usual port: a test run then takes a free one, and says which.
const cluster = await ensureCluster(log, { portIfTaken: 'pick-free' });
try {
  log('type-checking the server, shared code, fakes, scripts and tests');
  check('type check', run(bin('tsc'), ['-p', 'server/tsconfig.json', '--noEmit']));

  log('prettier: every file in the style .prettierrc sets');
  check('code style', run(bin('prettier'), ['--check', '.']));

  log('vitest: shared, server and fakes');
  vitest('vitest', 'tests/vitest.config.ts');

  log('vitest: load, crash and outage tests, one file at a time');
  vitest('faults', 'tests/faults/vitest.config.ts');

  log('Karma: Angular components in headless Chromium');
  const karmaCounts = join(resultsDir, 'karma.json');
  const karmaOk = run(bin('ng'), ['test', '--watch=false'], {
    CHROME_BIN: '/usr/bin/chromium',
    KEYLOOM_KARMA_COUNTS: karmaCounts,
  });
  const karma: Counts = existsSync(karmaCounts)
    ? JSON.parse(readFileSync(karmaCounts, 'utf8'))
    : { passed: 0, failed: 1, skipped: 0 };
  suites.push({ name: 'karma', ok: karmaOk && karma.failed === 0, counts: karma });

  let built = true;
  try {
    ensureBuild(log);
  } catch (error) {
    log((error as Error).message);
    built = false;
  }
  check('production build', built);
  if (built) {
    log('end-to-end: the app in Chromium against a server this run starts');
    vitest('e2e', 'tests/e2e/vitest.config.ts');
  }
} finally {
  // A failure to stop is said, and the summary below still printed.
  if (cluster.startedHere)
    await cluster
      .stop()
      .catch((error: Error) => log(`stopping PostgreSQL: ${error.message.split('\n')[0]}`));
}

const total = suites.reduce(
  (sum, s) => ({
    passed: sum.passed + s.counts.passed,
    failed: sum.failed + s.counts.failed,
    skipped: sum.skipped + s.counts.skipped,
  }),
  { passed: 0, failed: 0, skipped: 0 },
);
console.log('');
for (const s of suites) {
  console.log(
    `  ${s.ok ? 'ok  ' : 'FAIL'} ${s.name}: ${s.counts.passed} passed, ${s.counts.failed} failed`,
  );
}
console.log('');
console.log(
  `${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`,
);
process.exit(suites.every((s) => s.ok) ? 0 : 1);
