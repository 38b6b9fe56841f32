/**
 * Row type of `model_revisions` and its JSON presentation. Revisions are
 * immutable: this module inserts and reads them, and changes only the release
 * columns (a trigger, migration 20261202200300, refuses anything else).
 */
import type { Knex } from 'knex';
import type { UserRef } from '../contracts/fit-runs';

export interface RevisionRow {
  id: number;
  pulsar_id: number;
  parent_id: number | null;
  author_id: number | null;
  message: string;
  model_json: string;
  created_at: Date;
  released_at: Date | null;
  released_by: number | null;
  release_note: string | null;
}

export interface Revision {
  id: number;
  pulsarId: number;
  parentId: number | null;
  author: UserRef | null;
  message: string;
  createdAt: string;
  releasedAt: string | null;
  releasedBy: UserRef | null;
  releaseNote: string | null;
}

export type RevisionWithModel = Revision & { model: Record<string, unknown> };

/** Display names of the given user ids (missing users are left out). */
export async function userRefs(knex: Knex, ids: readonly (number | null)[]): Promise<Map<number, UserRef>> {
  const wanted = [...new Set(ids.filter((id): id is number => id !== null))];
  if (wanted.length === 0) return new Map();
  const rows = (await knex('users').whereIn('id', wanted).select('id', 'display_name')) as { id: number; display_name: string }[];
  return new Map(rows.map((r) => [r.id, { id: r.id, displayName: r.display_name }]));
}

export function presentRevision(row: RevisionRow, users: Map<number, UserRef>): Revision {
  return {
    id: row.id,
    pulsarId: row.pulsar_id,
    parentId: row.parent_id,
    author: row.author_id === null ? null : (users.get(row.author_id) ?? null),
    message: row.message,
    createdAt: row.created_at.toISOString(),
    releasedAt: row.released_at ? row.released_at.toISOString() : null,
    releasedBy: row.released_by === null ? null : (users.get(row.released_by) ?? null),
    releaseNote: row.release_note,
  };
}

export async function presentRevisions(knex: Knex, rows: readonly RevisionRow[]): Promise<Revision[]> {
  const users = await userRefs(knex, rows.flatMap((r) => [r.author_id, r.released_by]));
  return rows.map((r) => presentRevision(r, users));
}

export async function presentRevisionWithModel(knex: Knex, row: RevisionRow): Promise<RevisionWithModel> {
  const [revision] = await presentRevisions(knex, [row]);
  return { ...revision, model: JSON.parse(row.model_json) as Record<string, unknown> };
}

export async function findRevision(knex: Knex, id: number): Promise<RevisionRow | undefined> {
  return (await knex<RevisionRow>('model_revisions').where({ id }).first()) as RevisionRow | undefined;
}

export interface NewRevision {
  pulsarId: number;
  parentId: number | null;
  authorId: number;
  message: string;
  modelJson: string;
}

export async function insertRevision(knex: Knex, r: NewRevision): Promise<number> {
  const [id] = await knex('model_revisions').insert({
    pulsar_id: r.pulsarId,
    parent_id: r.parentId,
    author_id: r.authorId,
    message: r.message,
    model_json: r.modelJson,
  });
  return Number(id);
}

/** The only update of a revision: its release columns (all null to withdraw the release). */
export async function setRevisionRelease(
  knex: Knex,
  id: number,
  release: { releasedAt: Date; releasedBy: number; releaseNote: string } | null,
): Promise<void> {
  await knex('model_revisions').where({ id }).update({
    released_at: release?.releasedAt ?? null,
    released_by: release?.releasedBy ?? null,
    release_note: release?.releaseNote ?? null,
  });
}
