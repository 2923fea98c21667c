import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

const ROOT = join(__dirname, '..', '..', '..');
export const E2E_PORT = Number(process.env.E2E_PORT ?? 3100);

/** Starts the built server (API + built front end) on its own port against the test database, with the demo users. */
export default async function globalSetup(): Promise<void> {
  for (const f of ['backend/dist/main.js', 'frontend/dist/index.html', 'seed/dist/index.js']) {
    if (!existsSync(join(ROOT, f))) throw new Error(`${f} is missing: run the tests with npm test, which builds first`);
  }
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const seed = require(join(ROOT, 'seed/dist/index.js'));
  const db = await seed.connectPg(process.env.DATABASE_URL);
  try {
    const rows = await db.query(`SELECT count(*)::int AS n FROM users WHERE email = 'admin@amberline.example'`);
    if (rows[0].n === 0) await seed.seedDemo(db);
  } finally {
    await db.close();
  }
  const server = spawn(process.execPath, [join(ROOT, 'backend/dist/main.js')], {
    env: { ...process.env, PORT: String(E2E_PORT), HOST: '127.0.0.1', NODE_ENV: 'test', NODE_OPTIONS: '', MAIL_SEND_INTERVAL_MS: process.env.E2E_MAIL_SEND_INTERVAL_MS ?? '1000' },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  (globalThis as { __amberlineServer?: typeof server }).__amberlineServer = server;
  const deadline = Date.now() + 30000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`server exited with ${server.exitCode}`);
    try {
      const res = await fetch(`http://127.0.0.1:${E2E_PORT}/api/health`);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  server.kill();
  throw new Error('server did not come up within 30 s');
}
