/** What the API keeps in a session (express-session's SessionData is augmented here). */
import type { Request } from 'express';

declare module 'express-session' {
  interface SessionData {
    userId?: number;
  }
}

/** New session id (against fixation), then the user id; saved before the response. */
export async function signInSession(req: Request, userId: number): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  await new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export async function destroySession(req: Request): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}
