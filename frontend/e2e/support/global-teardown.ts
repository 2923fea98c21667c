import type { ChildProcess } from 'node:child_process';

export default async function globalTeardown(): Promise<void> {
  const server = (globalThis as { __amberlineServer?: ChildProcess }).__amberlineServer;
  if (server && server.exitCode === null) {
    const exited = new Promise((r) => server.once('exit', r));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
  }
}
