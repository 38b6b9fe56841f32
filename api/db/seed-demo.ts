/**
 * Demo data for `npm start` (dev profile only): the invented "Fenmarsh Pulsar
 * Group" with one account per role, the engine's fictional built-in
 * observatories, four invented pulsars with simulated TOAs and starting models
 * (api/db/demo-scenario/). Idempotent:
 * rows that exist (by e-mail, code, name) are left as they are.
 */
import type { Knex } from 'knex';
import { builtinObservatories } from '../../worker/timing/earth/builtin-observatories';
import { hashPassword } from '../auth/passwords';
import type { Role } from '../auth/permissions';
import { observatoryColumns, replaceClockCorrections } from './observatories';
import { DEMO_PULSAR_POSITIONS } from './demo-scenario/demo-pulsars';
import { seedDemoTiming } from './demo-scenario/seed-demo-timing';

export interface DemoSignIn {
  email: string;
  password: string;
  role: Role;
}

// Demo only: these passwords are printed by `npm start`.
const DEMO_USERS: (DemoSignIn & { displayName: string })[] = [
  { role: 'viewer', email: 'viewer@pulsekeeper.test', password: 'fenmarsh-viewer-demo', displayName: 'Vera Quill (viewer)' },
  { role: 'observer', email: 'observer@pulsekeeper.test', password: 'fenmarsh-observer-demo', displayName: 'Otto Brackwater (observer)' },
  { role: 'analyst', email: 'analyst@pulsekeeper.test', password: 'fenmarsh-analyst-demo', displayName: 'Ana Lindqvist-Moor (analyst)' },
  { role: 'lead', email: 'lead@pulsekeeper.test', password: 'fenmarsh-lead-demo', displayName: 'Leda Fenwright (group lead)' },
  { role: 'admin', email: 'admin@pulsekeeper.test', password: 'fenmarsh-admin-demo', displayName: 'Adam Reedbank (administrator)' },
];

// Invented names and positions (random points on the sky, not catalogue sources): the demo timing
// scenario's pulsars (api/db/demo-scenario/demo-pulsars.ts).
const DEMO_PULSARS = DEMO_PULSAR_POSITIONS;

export async function seedDemo(knex: Knex): Promise<{ users: DemoSignIn[] }> {
  for (const user of DEMO_USERS) {
    if (await knex('users').where({ email: user.email }).first('id')) continue;
    await knex('users').insert({
      email: user.email,
      display_name: user.displayName,
      role: user.role,
      password_hash: await hashPassword(user.password),
    });
  }
  for (const site of builtinObservatories()) {
    if (await knex('observatories').where({ code: site.code }).first('id')) continue;
    await knex.transaction(async (trx) => {
      const [id] = await trx('observatories').insert(observatoryColumns(site));
      await replaceClockCorrections(trx, id, site.clockCorrections);
    });
  }
  const lead = await knex('users').where({ email: 'lead@pulsekeeper.test' }).first('id');
  for (const pulsar of DEMO_PULSARS) {
    if (await knex('pulsars').where({ name: pulsar.name }).first('id')) continue;
    await knex('pulsars').insert({ ...pulsar, created_by: lead?.id ?? null });
  }
  // simulated TOAs (uploaded by the observer) and starting models (authored by the analyst)
  const observer = await knex('users').where({ email: 'observer@pulsekeeper.test' }).first('id');
  const analyst = await knex('users').where({ email: 'analyst@pulsekeeper.test' }).first('id');
  await seedDemoTiming(knex, { uploaderId: Number(observer.id), authorId: Number(analyst.id) });
  return { users: DEMO_USERS.map(({ email, password, role }) => ({ email, password, role })) };
}
