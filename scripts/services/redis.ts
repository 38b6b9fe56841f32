/**
 * A private Redis server from Debian's package on loopback and a non-default
 * port, without persistence (STACK.md §4). BullMQ needs the real server: its
 * Lua scripts use cmsgpack, which in-memory fakes lack.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Config } from '../../api/config';
import { livePid, run, waitFor, waitForExit } from './process-tools';

function redisPaths(config: Config) {
  const dir = path.join(config.dataDir, 'redis');
  return { dir, pidFile: path.join(dir, 'redis.pid'), logFile: path.join(dir, 'redis.log') };
}

async function ping(config: Config): Promise<boolean> {
  const { stdout } = await run('redis-cli', ['-h', config.redis.host, '-p', String(config.redis.port), 'ping']);
  return stdout.trim() === 'PONG';
}

export async function startRedis(config: Config): Promise<{ started: boolean }> {
  const paths = redisPaths(config);
  if (livePid(paths.pidFile) !== null && (await ping(config).catch(() => false))) return { started: false };
  mkdirSync(paths.dir, { recursive: true });
  await run('redis-server', [
    '--port', String(config.redis.port), '--bind', config.redis.host, '--protected-mode', 'yes',
    '--save', '', '--appendonly', 'no', '--daemonize', 'yes',
    '--pidfile', paths.pidFile, '--logfile', paths.logFile, '--dir', paths.dir,
  ]);
  await waitFor(`Redis on ${config.redis.host}:${config.redis.port} (log: ${paths.logFile})`, () => ping(config));
  return { started: true };
}

export async function stopRedis(config: Config): Promise<void> {
  const pid = livePid(redisPaths(config).pidFile);
  if (pid === null) return;
  await run('redis-cli', ['-h', config.redis.host, '-p', String(config.redis.port), 'shutdown', 'nosave']).catch(() => {
    process.kill(pid, 'SIGTERM');
  });
  await waitForExit(pid);
}
