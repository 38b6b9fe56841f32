/**
 * `npm start`: private MariaDB and Redis (dev profile), migrations, the demo
 * scenario, the client build (skipped when up to date), then the API (serving
 * the built client) and the worker. Ctrl-C stops everything it started.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import knexFactory from 'knex';
import { knexConfig } from '../knexfile';
import { seedDemo } from '../api/db/seed-demo';
import { runChildren } from './run-children';
import { startServices } from './services/services';

const t0 = Date.now();
const services = await startServices({ profile: 'dev' });
Object.assign(process.env, services.env);
const { config } = services;

const knex = knexFactory(knexConfig(config));
const demo = await seedDemo(knex);
await knex.destroy();

/** Newest modification time under the client's sources. */
function newestSourceMs(entries: string[]): number {
  let newest = 0;
  for (const entry of entries) {
    if (!existsSync(entry)) continue;
    const stat = statSync(entry);
    if (stat.isDirectory()) {
      newest = Math.max(newest, newestSourceMs(readdirSync(entry).map((name) => path.join(entry, name))));
    } else newest = Math.max(newest, stat.mtimeMs);
  }
  return newest;
}
const builtIndex = path.join(config.rootDir, 'dist', 'index.html');
const sources = ['web', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'].map((p) => path.join(config.rootDir, p));
if (!existsSync(builtIndex) || statSync(builtIndex).mtimeMs < newestSourceMs(sources)) {
  console.log('Building the client…');
  const build = spawnSync('node_modules/.bin/vite', ['build', '--logLevel', 'warn'], { stdio: 'inherit' });
  if (build.status !== 0) {
    await services.stop();
    process.exit(build.status ?? 1);
  }
}

runChildren(
  [
    { name: 'api', command: 'node_modules/.bin/tsx', args: ['api/server.ts'], env: services.env },
    { name: 'worker', command: 'node_modules/.bin/tsx', args: ['worker/index.ts'], env: services.env },
  ],
  () => services.stop(),
);

const url = config.api.publicUrl;
console.log(`
Pulsekeeper is starting at ${url}  (set up in ${((Date.now() - t0) / 1000).toFixed(1)} s)
Demo sign-ins (demo only):
${demo.users.map((u) => `  ${u.role.padEnd(9)} ${u.email.padEnd(32)} ${u.password}`).join('\n')}
Press Ctrl-C to stop the API, the worker, MariaDB and Redis.
`);
