/**
 * The invented demo timing scenario (docs/formats.md §2 model files): four
 * invented pulsars, each with its TRUE model (used only to simulate the TOAs
 * and in tests; never stored), the STARTING model stored as the first
 * revision, and the observing plan the TOAs are simulated from. Names,
 * positions and every parameter value are invented; they describe no real
 * source.
 *
 * Every pulsar's true model has the `narrowband-2` backend 1.47 µs late; every
 * starting model carries that offset at 0 and not in `solve_for` (the analyst
 * has to notice the step between the backends and switch it on).
 */

/** One block of simulated observations: evenly spread TOAs at one observatory, backend and frequency. */
export interface ObservingBlock {
  observatory: 'harrow-ridge' | 'cardenal-plateau';
  backend: 'wideband-1' | 'narrowband-2';
  frequencyMhz: number;
  startMjd: string;
  endMjd: string;
  count: number;
  /** multiplies the pulsar's base TOA uncertainty (lower S/N at some frequencies) */
  uncertaintyFactor: number;
}

/** One upload batch: the blocks of one observatory, written as one CSV file. */
export interface DemoBatchPlan {
  fileName: string;
  observatory: ObservingBlock['observatory'];
}

export interface DemoPulsarPlan {
  name: string;
  description: string;
  trueModel: Record<string, unknown>;
  startingModel: Record<string, unknown>;
  baseUncertaintyUs: number;
  blocks: ObservingBlock[];
  batches: DemoBatchPlan[];
  /** first seed of the blocks (block k uses seedBase + k) */
  seedBase: number;
}

export const DEMO_BACKEND_OFFSET_S = 1.47e-6; // narrowband-2 relative to wideband-1 (invented)
export const DEMO_SPIN_EPOCH_MJD = '59750';

/** The observing plan shared by all four pulsars; counts are scaled per pulsar. */
function observingBlocks(countScale: number): ObservingBlock[] {
  const n = (count: number): number => Math.round(count * countScale);
  return [
    { observatory: 'harrow-ridge', backend: 'wideband-1', frequencyMhz: 742, startMjd: '58500', endMjd: '61000', count: n(90), uncertaintyFactor: 1.4 },
    { observatory: 'harrow-ridge', backend: 'wideband-1', frequencyMhz: 1384, startMjd: '58500', endMjd: '61000', count: n(130), uncertaintyFactor: 1.0 },
    { observatory: 'harrow-ridge', backend: 'wideband-1', frequencyMhz: 2231, startMjd: '58500', endMjd: '61000', count: n(70), uncertaintyFactor: 1.6 },
    { observatory: 'harrow-ridge', backend: 'narrowband-2', frequencyMhz: 1452, startMjd: '58830', endMjd: '61000', count: n(80), uncertaintyFactor: 0.9 },
    { observatory: 'harrow-ridge', backend: 'narrowband-2', frequencyMhz: 2968, startMjd: '59300', endMjd: '61000', count: n(40), uncertaintyFactor: 2.0 },
    // the clock-correction table of cardenal-plateau covers MJD 58000–60000, so its TOAs stay inside it
    { observatory: 'cardenal-plateau', backend: 'wideband-1', frequencyMhz: 1017, startMjd: '58610', endMjd: '59960', count: n(60), uncertaintyFactor: 1.2 },
    { observatory: 'cardenal-plateau', backend: 'narrowband-2', frequencyMhz: 1533, startMjd: '58700', endMjd: '59940', count: n(45), uncertaintyFactor: 1.1 },
  ];
}

function batchPlans(name: string): DemoBatchPlan[] {
  const stem = name.toLowerCase();
  return [
    { fileName: `${stem}_harrow-ridge_2019-2025.csv`, observatory: 'harrow-ridge' },
    { fileName: `${stem}_cardenal-plateau_2019-2022.csv`, observatory: 'cardenal-plateau' },
  ];
}

const NARROWBAND_OFFSET_TRUE = [{ backend: 'narrowband-2', seconds: DEMO_BACKEND_OFFSET_S }];
const NARROWBAND_OFFSET_START = [{ backend: 'narrowband-2', seconds: 0 }];

function modelFile(pulsar: string, body: Record<string, unknown>): Record<string, unknown> {
  return { format: 'pulsekeeper-model/1', pulsar, epoch_mjd: DEMO_SPIN_EPOCH_MJD, ...body };
}

// 1. A young pulsar with strong spin-down; the starting spin-down rate is off by 3.7e-18 Hz/s
//    (a parabola of ~3 ms at the ends of the span) and the starting DM by 0.017 pc/cm^3.
const YOUNG = 'FPG-J0412+2733';
const youngAstrometry = { ra_hms: '04:12:37.2518', dec_dms: '+27:33:12.804', pm_ra_cosdec_mas_per_yr: 0, pm_dec_mas_per_yr: 0, parallax_mas: 0 };
const young: DemoPulsarPlan = {
  name: YOUNG,
  description: 'Young pulsar with strong spin-down; the starting spin-down rate is slightly wrong (a parabola in the residuals).',
  trueModel: modelFile(YOUNG, {
    spin: { frequency_hz: '7.213641887523', frequency_derivatives: ['-5.1180037e-12'] },
    astrometry: youngAstrometry,
    dispersion: { dm_pc_per_cm3: 48.317, dm_derivatives: [] },
    offsets: NARROWBAND_OFFSET_TRUE,
  }),
  startingModel: modelFile(YOUNG, {
    spin: { frequency_hz: '7.2136418876', frequency_derivatives: ['-5.118e-12'] },
    astrometry: youngAstrometry,
    dispersion: { dm_pc_per_cm3: 48.3, dm_derivatives: [] },
    offsets: NARROWBAND_OFFSET_START,
    solve_for: ['spin.frequency_hz', 'dispersion.dm_pc_per_cm3'],
  }),
  baseUncertaintyUs: 100,
  blocks: observingBlocks(1),
  batches: batchPlans(YOUNG),
  seedBase: 101,
};

// 2. An eccentric binary millisecond pulsar; the starting orbit is slightly off in every
//    element (a few hundred µs of orbital residuals, still phase-connected at 2.9 ms).
const BINARY = 'FPG-J1517-0654';
const binaryAstrometry = { ra_hms: '15:17:05.9032', dec_dms: '-06:54:48.117', pm_ra_cosdec_mas_per_yr: -4.2, pm_dec_mas_per_yr: -11.7, parallax_mas: 0.9 };
const binary: DemoPulsarPlan = {
  name: BINARY,
  description: 'Eccentric binary millisecond pulsar (8.1-day orbit, e ≈ 0.3); the starting orbital elements are slightly off.',
  trueModel: modelFile(BINARY, {
    spin: { frequency_hz: '346.52871390216', frequency_derivatives: ['-1.37e-15'] },
    astrometry: binaryAstrometry,
    dispersion: { dm_pc_per_cm3: 21.7043, dm_derivatives: [] },
    companions: [{
      name: 'b', kind: 'keplerian', enabled: true,
      period_days: '8.1317945', projected_semimajor_axis_lt_s: '5.18842', eccentricity: 0.30427,
      periastron_longitude_deg: 112.3812, periastron_epoch_mjd: '59748.31724',
    }],
    offsets: NARROWBAND_OFFSET_TRUE,
  }),
  startingModel: modelFile(BINARY, {
    spin: { frequency_hz: '346.52871390216', frequency_derivatives: ['-1.37e-15'] },
    astrometry: binaryAstrometry,
    dispersion: { dm_pc_per_cm3: 21.704, dm_derivatives: [] },
    companions: [{
      name: 'b', kind: 'keplerian', enabled: true,
      period_days: '8.131794', projected_semimajor_axis_lt_s: '5.1884', eccentricity: 0.3043,
      periastron_longitude_deg: 112.38, periastron_epoch_mjd: '59748.3172',
    }],
    offsets: NARROWBAND_OFFSET_START,
    solve_for: [
      'spin.frequency_hz', 'spin.frequency_derivatives[0]', 'dispersion.dm_pc_per_cm3',
      'companions[b].period_days', 'companions[b].projected_semimajor_axis_lt_s', 'companions[b].eccentricity',
      'companions[b].periastron_longitude_deg', 'companions[b].periastron_epoch_mjd',
    ],
  }),
  baseUncertaintyUs: 1,
  blocks: observingBlocks(1.05),
  batches: batchPlans(BINARY),
  seedBase: 201,
};

// 3. A pulsar with two small companions (light-travel-time signals of 42 and 130 µs at
//    71.4 and 283.6 days); the starting model has none.
const HIDDEN = 'FPG-J2208+4121';
const hiddenAstrometry = { ra_hms: '22:08:51.4470', dec_dms: '+41:21:03.590', pm_ra_cosdec_mas_per_yr: 6.1, pm_dec_mas_per_yr: -2.4, parallax_mas: 1.3 };
export const HIDDEN_COMPANIONS = [
  {
    name: 'inner', kind: 'keplerian', enabled: true,
    period_days: '71.38', projected_semimajor_axis_lt_s: '4.2e-5', eccentricity: 0.04,
    periastron_longitude_deg: 48.5, periastron_epoch_mjd: '59712.6',
  },
  {
    name: 'outer', kind: 'keplerian', enabled: true,
    period_days: '283.6', projected_semimajor_axis_lt_s: '1.3e-4', eccentricity: 0.09,
    periastron_longitude_deg: 231.2, periastron_epoch_mjd: '59830.1',
  },
];
const hidden: DemoPulsarPlan = {
  name: HIDDEN,
  description: 'Millisecond pulsar whose residuals hide two small companions (periods of about 71 and 284 days); the starting model has none.',
  trueModel: modelFile(HIDDEN, {
    spin: { frequency_hz: '189.9136207143', frequency_derivatives: ['-2.93e-16'] },
    astrometry: hiddenAstrometry,
    dispersion: { dm_pc_per_cm3: 13.8815, dm_derivatives: [] },
    companions: HIDDEN_COMPANIONS,
    offsets: NARROWBAND_OFFSET_TRUE,
  }),
  startingModel: modelFile(HIDDEN, {
    spin: { frequency_hz: '189.9136207143', frequency_derivatives: ['-2.93e-16'] },
    astrometry: hiddenAstrometry,
    dispersion: { dm_pc_per_cm3: 13.8815, dm_derivatives: [] },
    offsets: NARROWBAND_OFFSET_START,
    solve_for: ['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'astrometry.ra_hms', 'astrometry.dec_dms', 'dispersion.dm_pc_per_cm3'],
  }),
  baseUncertaintyUs: 0.6,
  blocks: observingBlocks(1.1),
  batches: batchPlans(HIDDEN),
  seedBase: 301,
};

// 4. A pulsar whose starting position is ~25 mas off (RA by 1.4 ms of time, Dec by 15 mas):
//    an annual wave of ~50 µs: the Roemer delay r·n̂/c (docs/formats.md §4) changes by up to
//    1 au/c ≈ 499 s times the angle in radians (1 au/c: IAU 2012 au and the defined c).
const OFFSKY = 'FPG-J1839-1127';
const offskyTrueAstrometry = { ra_hms: '18:39:14.77310', dec_dms: '-11:27:35.0620', pm_ra_cosdec_mas_per_yr: -1.7, pm_dec_mas_per_yr: -6.3, parallax_mas: 0 };
const offsky: DemoPulsarPlan = {
  name: OFFSKY,
  description: 'Millisecond pulsar whose starting position is slightly wrong (an annual wave in the residuals).',
  trueModel: modelFile(OFFSKY, {
    spin: { frequency_hz: '261.70382251473', frequency_derivatives: ['-8.64e-16'] },
    astrometry: offskyTrueAstrometry,
    dispersion: { dm_pc_per_cm3: 35.2206, dm_derivatives: [] },
    offsets: NARROWBAND_OFFSET_TRUE,
  }),
  startingModel: modelFile(OFFSKY, {
    spin: { frequency_hz: '261.70382251473', frequency_derivatives: ['-8.64e-16'] },
    astrometry: { ...offskyTrueAstrometry, ra_hms: '18:39:14.7745', dec_dms: '-11:27:35.047' },
    dispersion: { dm_pc_per_cm3: 35.22, dm_derivatives: [] },
    offsets: NARROWBAND_OFFSET_START,
    solve_for: ['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'dispersion.dm_pc_per_cm3'],
  }),
  baseUncertaintyUs: 1,
  blocks: observingBlocks(0.95),
  batches: batchPlans(OFFSKY),
  seedBase: 401,
};

/** The four demo pulsars in a fixed order. */
export const DEMO_PULSAR_PLANS: readonly DemoPulsarPlan[] = [young, binary, hidden, offsky];

/** Name and catalogue position (the starting model's) of each demo pulsar, for the pulsars table. */
export const DEMO_PULSAR_POSITIONS = DEMO_PULSAR_PLANS.map((p) => {
  const astrometry = p.startingModel.astrometry as { ra_hms: string; dec_dms: string };
  return { name: p.name, ra_hms: astrometry.ra_hms, dec_dms: astrometry.dec_dms };
});

export const STARTING_REVISION_MESSAGE = 'Starting model from the discovery observations';
