/**
 * A private MariaDB server from Debian's package: data folder under .data/,
 * loopback only, a non-default port, its own socket and pid file. Follows the
 * commands verified in STACK.md §3 (the server must run with --user=root when
 * started by root; `ping` answers even with wrong credentials, so readiness is
 * proved by a real login).
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Config } from '../../api/config';
import { livePid, logTail, run, ServiceStartError, waitFor, waitForExit } from './process-tools';

export interface MariaDbPaths { dataDir: string; socket: string; pidFile: string; logFile: string }

export function mariaDbPaths(config: Config): MariaDbPaths {
  const base = path.join(config.dataDir, 'mariadb');
  return {
    dataDir: path.join(base, 'data'),
    socket: path.join(base, 'mariadb.sock'),
    pidFile: path.join(base, 'mariadb.pid'),
    logFile: path.join(base, 'mariadb.err'),
  };
}

async function rootSql(paths: MariaDbPaths, sql: string): Promise<string> {
  const { stdout } = await run('mariadb', ['--no-defaults', `--socket=${paths.socket}`, '-uroot', '-N', '-e', sql]);
  return stdout;
}

/** Starts the server if it is not already running; returns whether this call started it. */
export async function startMariaDb(config: Config): Promise<{ started: boolean; pid: number }> {
  const paths = mariaDbPaths(config);
  const running = livePid(paths.pidFile);
  if (running !== null) {
    await ensureDatabase(config, paths);
    return { started: false, pid: running };
  }
  mkdirSync(path.dirname(paths.dataDir), { recursive: true });
  if (!existsSync(path.join(paths.dataDir, 'mysql'))) {
    await run('mariadb-install-db', [
      '--no-defaults', '--user=root', `--datadir=${paths.dataDir}`,
      '--auth-root-authentication-method=socket', '--skip-test-db',
    ]);
  }
  const child = spawn('mariadbd', [
    '--no-defaults', '--user=root', `--datadir=${paths.dataDir}`,
    `--port=${config.db.port}`, `--bind-address=${config.db.host}`,
    `--socket=${paths.socket}`, `--pid-file=${paths.pidFile}`, `--log-error=${paths.logFile}`,
    '--skip-name-resolve', '--max-allowed-packet=256M', '--innodb-buffer-pool-size=256M',
    '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
  ], { detached: true, stdio: 'ignore' });
  child.unref();
  let exited: number | null = null;
  child.once('exit', (code) => {
    exited = code ?? 1;
  });
  await waitFor(`MariaDB on ${config.db.host}:${config.db.port} (log: ${paths.logFile})`, async () => {
    if (exited !== null) throw new ServiceStartError(`MariaDB exited (${exited}) while starting: ${logTail(paths.logFile)}`);
    await rootSql(paths, 'SELECT 1');
    return true;
  });
  await ensureDatabase(config, paths);
  return { started: true, pid: child.pid! };
}

/** Creates the database and the application user if missing (idempotent). */
async function ensureDatabase(config: Config, paths: MariaDbPaths): Promise<void> {
  const { database, user, password, host } = config.db;
  const quoted = password.replace(/'/g, "''");
  await rootSql(paths, [
    `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;`,
    `CREATE USER IF NOT EXISTS '${user}'@'${host}' IDENTIFIED BY '${quoted}';`,
    `ALTER USER '${user}'@'${host}' IDENTIFIED BY '${quoted}';`,
    `GRANT ALL ON \`${database}\`.* TO '${user}'@'${host}';`,
  ].join(' '));
}

/** Drops and recreates the profile's database (tests start from an empty schema). */
export async function resetDatabase(config: Config): Promise<void> {
  const paths = mariaDbPaths(config);
  await rootSql(paths, `DROP DATABASE IF EXISTS \`${config.db.database}\`;`);
  await ensureDatabase(config, paths);
}

export async function stopMariaDb(config: Config): Promise<void> {
  const paths = mariaDbPaths(config);
  const pid = livePid(paths.pidFile);
  if (pid === null) return;
  await run('mariadb-admin', ['--no-defaults', `--socket=${paths.socket}`, '-uroot', 'shutdown']).catch(() => {
    process.kill(pid, 'SIGTERM');
  });
  await waitForExit(pid);
}
