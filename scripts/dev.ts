/**
 * `npm run dev`: the same private services as `npm start`, then the Vite dev
 * server with hot reload (proxying /api) and the API and worker in watch mode.
 */
import knexFactory from 'knex';
import { knexConfig } from '../knexfile';
import { seedDemo } from '../api/db/seed-demo';
import { runChildren } from './run-children';
import { startServices } from './services/services';

const services = await startServices({ profile: 'dev' });
Object.assign(process.env, services.env);
const knex = knexFactory(knexConfig(services.config));
await seedDemo(knex);
await knex.destroy();

runChildren(
  [
    { name: 'web', command: 'node_modules/.bin/vite', args: ['--host', '127.0.0.1'], env: services.env },
    { name: 'api', command: 'node_modules/.bin/tsx', args: ['watch', 'api/server.ts'], env: services.env },
    { name: 'worker', command: 'node_modules/.bin/tsx', args: ['watch', 'worker/index.ts'], env: services.env },
  ],
  () => services.stop(),
);
console.log('Dev server: http://127.0.0.1:5173 (API on ' + services.config.api.publicUrl + ')');
