import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

// the reporter `npm test` counts with (backend/scripts/count-reporter.cjs)
// eslint-disable-next-line @typescript-eslint/no-require-imports
const CountReporter = require('../scripts/count-reporter.cjs') as new () => { onRunComplete: (contexts: unknown, results: unknown) => void };

/** `npm test`'s closing line counts every test, even when a failure's error is not serialisable. */
describe('the closing line of npm test', () => {
  it('counts each test once, a failure with a circular error as a failure, and a file that could not run as one failure', () => {
    const file = join(mkdtempSync(join(tmpdir(), 'counts-')), 'counts.json');
    process.env.JEST_COUNTS_FILE = file;
    const circular: Record<string, unknown> = { message: 'socket hang up' };
    circular.self = circular;
    const results = {
      testResults: [
        { testResults: [{ status: 'passed' }, { status: 'failed', failureDetails: [circular] }, { status: 'pending' }] },
        { testResults: [{ status: 'passed' }, { status: 'passed' }] },
        { testResults: [], testExecError: circular, failureMessage: 'Test suite failed to run' },
      ],
    };
    expect(() => JSON.stringify(results)).toThrow(/circular/i); // what jest's --json writer would have to do
    new CountReporter().onRunComplete(new Set(), results);
    expect(JSON.parse(readFileSync(file, 'utf8'))).toEqual({ passed: 3, failed: 2, total: 5 });
    delete process.env.JEST_COUNTS_FILE;
  });
});

/** On a fresh machine the scripts install PostgreSQL and Chromium as root, or say exactly what to install. */
describe('the Debian packages the scripts need', () => {
  const script = join(__dirname, '..', 'scripts', 'system-deps.sh');
  const run = (env: Record<string, string>, ...what: string[]) => spawnSync('bash', [script, ...what], { env: { ...process.env, ...env }, encoding: 'utf8' });

  it('passes quietly when they are there (this machine runs the tests with both)', () => {
    const res = run({}, 'postgresql', 'chromium');
    expect({ status: res.status, out: res.stdout + res.stderr }).toEqual({ status: 0, out: '' });
  });

  it('names the missing package and the exact command when it may not install it', () => {
    const res = run({ CHROMIUM_PATH: '/nonexistent/chromium', SYSTEM_DEPS_INSTALL: 'no' }, 'postgresql', 'chromium');
    expect(res.status).toBe(1);
    expect(res.stderr).toContain('missing Debian packages: chromium');
    expect(res.stderr).toContain('apt-get install -y chromium');
    expect(res.stderr).not.toContain('postgresql');
  });
});
