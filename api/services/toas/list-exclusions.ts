/** A pulsar's exclusion history (active and restored), newest first. */
import type { Knex } from 'knex';
import type { ToaExclusion } from '../../contracts/toas';
import { notFound } from '../../errors';

interface ExclusionRow {
  id: number;
  toa_id: number | string;
  reason: string;
  excluded_by: number | null;
  excluded_by_name: string | null;
  excluded_at: Date;
  restored_by: number | null;
  restored_by_name: string | null;
  restored_at: Date | null;
}

export async function listExclusions(knex: Knex, pulsarId: number): Promise<ToaExclusion[]> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const rows = (await knex('toa_exclusions as e')
    .leftJoin('users as ex', 'ex.id', 'e.excluded_by')
    .leftJoin('users as re', 're.id', 'e.restored_by')
    .where('e.pulsar_id', pulsarId)
    .orderBy('e.id', 'desc')
    .select('e.id', 'e.toa_id', 'e.reason', 'e.excluded_by', 'ex.display_name as excluded_by_name', 'e.excluded_at', 'e.restored_by', 're.display_name as restored_by_name', 'e.restored_at')) as ExclusionRow[];
  return rows.map((r) => ({
    id: r.id,
    toaId: Number(r.toa_id),
    reason: r.reason,
    excludedBy: r.excluded_by === null ? null : { id: r.excluded_by, displayName: r.excluded_by_name ?? '' },
    excludedAt: r.excluded_at.toISOString(),
    restoredBy: r.restored_by === null ? null : { id: r.restored_by, displayName: r.restored_by_name ?? '' },
    restoredAt: r.restored_at === null ? null : r.restored_at.toISOString(),
  }));
}
