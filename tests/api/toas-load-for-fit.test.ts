/** loadToasForFit: the included TOAs of a pulsar as engine Toas, exact MJDs, sorted, exclusions left out. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadToasForFit } from '../../api/db/load-toas-for-fit';
import { storeToaBatch } from '../../api/services/toas/store-toa-batch';
import { formatMjd, parseMjd } from '../../worker/timing/time/mjd-string';
import { bytesOf, createObservatoryRow, TOA_HEADER } from '../fixtures/uploads/toa-files';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let userId: number;
let observatory: string;

beforeAll(async () => {
  t = buildTestApp();
  userId = (await createUser(t.knex, 'observer')).id;
  observatory = await createObservatoryRow(t.knex);
});
afterAll(() => t.close());

describe('loadToasForFit', () => {
  it('returns every stored TOA sorted by MJD with exact MJDs and the stored fields', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const later = '58100.123456789012345678901234567';
    const earlier = '58000.000000000000000000000000000001';
    const file = [
      `${TOA_HEADER},pulse_number,note`,
      `${later},1.5,inf,${observatory},wide-a,42,"x, y"`,
      `${earlier},0.25,1400.5,ssb,wide-b,,`,
    ].join('\n');
    await storeToaBatch(t.knex, { pulsarId: pulsar.id, fileName: 'two.csv', uploadedBy: userId, bytes: bytesOf(file) });

    const { toas, toaIds, excludedIds } = await loadToasForFit(t.knex, pulsar.id);
    expect(toas).toHaveLength(2);
    expect(excludedIds).toEqual([]);
    expect(toaIds[0]).toBeGreaterThan(toaIds[1]); // the earlier MJD was the file's second row
    expect(formatMjd(toas[0].mjd, 36)).toBe(earlier.padEnd(42, '0'));
    expect(toas[0].mjd).toEqual(parseMjd(earlier));
    expect(toas[1].mjd).toEqual(parseMjd(later));
    expect(toas[0]).toMatchObject({ row: 1, line: 3, uncertaintyUs: 0.25, frequencyMhz: 1400.5, observatory: 'ssb', backend: 'wide-b', pulseNumber: null, labels: { note: '' } });
    expect(toas[1]).toMatchObject({ row: 2, line: 2, uncertaintyUs: 1.5, frequencyMhz: Infinity, observatory, backend: 'wide-a', pulseNumber: 42, labels: { note: 'x, y' } });
  });

  it('leaves out TOAs with an active exclusion and returns them again once restored', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const file = [TOA_HEADER, `58001.5,1,1400,${observatory},a`, `58002.5,1,1400,${observatory},a`, `58003.5,1,1400,${observatory},a`].join('\n');
    await storeToaBatch(t.knex, { pulsarId: pulsar.id, fileName: 'three.csv', uploadedBy: userId, bytes: bytesOf(file) });
    const all = await loadToasForFit(t.knex, pulsar.id);
    const middle = all.toaIds[1];
    const [exclusionId] = await t.knex('toa_exclusions').insert({ toa_id: middle, pulsar_id: pulsar.id, reason: 'test', excluded_by: userId });

    const without = await loadToasForFit(t.knex, pulsar.id);
    expect(without.toaIds).toEqual([all.toaIds[0], all.toaIds[2]]);
    expect(without.excludedIds).toEqual([middle]);
    expect(without.toas.map((x) => x.mjd.day)).toEqual([58001, 58003]);

    await t.knex('toa_exclusions').where({ id: exclusionId }).update({ restored_at: new Date(), restored_by: userId });
    const restored = await loadToasForFit(t.knex, pulsar.id);
    expect(restored.toaIds).toEqual(all.toaIds);
    expect(restored.excludedIds).toEqual([]);
  });

  it('gives empty arrays for a pulsar without TOAs', async () => {
    const pulsar = await createPulsarRow(t.knex);
    expect(await loadToasForFit(t.knex, pulsar.id)).toEqual({ toas: [], toaIds: [], excludedIds: [] });
  });
});
