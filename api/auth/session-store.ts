/**
 * connect-session-knex's store, made safe for express-session: the library
 * both calls back with an error and rejects its returned promise, which nobody
 * awaits, so a database hiccup became an unhandled rejection (fatal in Node
 * 20); `touch` rejects without calling back at all, which left the response
 * hanging. Here every method calls back exactly once and never rejects.
 */
import { ConnectSessionKnexStore } from 'connect-session-knex';
import type { SessionData } from 'express-session';
import type { Knex } from 'knex';

type Callback<T> = ((err: unknown, value?: T) => void) | undefined;

function once<T>(callback: Callback<T>) {
  let called = false;
  return (err: unknown, value?: T) => {
    if (called) return;
    called = true;
    callback?.(err, value);
  };
}

export class SessionStore extends ConnectSessionKnexStore {
  constructor(options: { knex: Knex; cleanupIntervalMs: number; onError: (err: unknown) => void }) {
    super({ knex: options.knex, tableName: 'sessions', createTable: false, cleanupInterval: options.cleanupIntervalMs, onDbCleanupError: options.onError });
    this.ready.catch(options.onError); // get/set report it again per request
  }

  /** Stops the cleanup timer (the store has no close()). */
  stopCleanup(): void {
    clearTimeout(this.nextDbCleanup);
  }

  override get(sid: string, callback: (err: any, session?: SessionData | null) => void): Promise<SessionData | null> {
    const done = once(callback);
    return super.get(sid, (err, s) => done(err, s)).catch((err: unknown) => (done(err), null));
  }

  override set(sid: string, session: SessionData, callback?: (err?: any) => void): Promise<void> {
    const done = once(callback);
    return super.set(sid, session, (err) => done(err)).catch((err: unknown) => done(err));
  }

  override touch(sid: string, session: SessionData, callback?: (err?: any) => void): Promise<void> {
    const done = once(callback);
    return super.touch(sid, session, () => done(null)).catch((err: unknown) => done(err));
  }

  override destroy(sid: string, callback?: (err?: any) => void): Promise<number> {
    const done = once(callback);
    return super.destroy(sid, (err) => done(err)).catch((err: unknown) => (done(err), 0));
  }
}
