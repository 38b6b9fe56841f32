/**
 * Vitest global setup for the server project: a private MariaDB (empty test
 * database, migrated) and Redis on the test profile's ports, stopped again
 * when the run ends (if this run started them).
 */
// Knex loads the .ts migrations with a native import(); Vitest's own process needs tsx's loader for that.
import { register } from 'tsx/esm/api';
import { startServices } from '../../scripts/services/services';

register();

export default async function setup(): Promise<() => Promise<void>> {
  const services = await startServices({ profile: 'test', resetDatabase: true });
  Object.assign(process.env, services.env);
  return () => services.stop();
}
