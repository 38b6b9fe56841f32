/** supertest agents that keep the session cookie and send the CSRF token the way the client does. */
import type { Application } from 'express';
import request from 'supertest';
import { expect } from 'vitest';

export type Agent = ReturnType<typeof request.agent>;

export interface Client {
  agent: Agent;
  csrf: string;
}

export async function fetchCsrf(agent: Agent): Promise<string> {
  const res = await agent.get('/api/auth/csrf').expect(200);
  return res.body.data.token as string;
}

/** An anonymous browser: a session holding only a CSRF token. */
export async function anonymousClient(app: Application): Promise<Client> {
  const agent = request.agent(app);
  return { agent, csrf: await fetchCsrf(agent) };
}

/** Signs in (fails the test if that fails) and fetches the new session's CSRF token. */
export async function signedInClient(app: Application, email: string, password: string): Promise<Client> {
  const { agent, csrf } = await anonymousClient(app);
  const res = await agent.post('/api/auth/sign-in').set('x-csrf-token', csrf).send({ email, password });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return { agent, csrf: await fetchCsrf(agent) };
}

/** The value of the session cookie a response set, if any. */
export function sessionCookie(res: { headers: Record<string, unknown> }): string | undefined {
  const cookies = (res.headers['set-cookie'] as string[] | undefined) ?? [];
  return cookies.find((c) => c.startsWith('pk.sid='))?.split(';')[0];
}
