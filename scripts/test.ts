/**
 * `npm test`: builds the client (the browser test drives the built app), then
 * runs every Vitest project. The server project's global setup starts the
 * private test MariaDB and Redis and stops them afterwards.
 */
import { spawnSync } from 'node:child_process';

function step(command: string, args: string[]): void {
  const result = spawnSync(command, args, { stdio: 'inherit', env: { ...process.env, PULSEKEEPER_PROFILE: 'test' } });
  if (result.status !== 0) process.exit(result.status ?? 1);
}

step('node_modules/.bin/vite', ['build', '--logLevel', 'warn']);
step('node_modules/.bin/vitest', ['run', ...process.argv.slice(2)]);
