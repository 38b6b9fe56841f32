import type { Pulsar } from '../api/get-pulsars';

export type PulsarStatus = 'no-toas' | 'not-fitted' | 'fit-queued' | 'fitting' | 'fitted' | 'fit-failed' | 'fit-cancelled';

export const PULSAR_STATUS_LABELS: Record<PulsarStatus, string> = {
  'no-toas': 'No TOAs',
  'not-fitted': 'Not fitted',
  'fit-queued': 'Fit queued',
  fitting: 'Fitting',
  fitted: 'Fitted',
  'fit-failed': 'Fit failed',
  'fit-cancelled': 'Fit cancelled',
};

/**
 * One word for where a pulsar stands in the workflow, from its TOA count and its newest fit.
 * The API has no pulsar status of its own; this is derived on the client.
 */
export function pulsarStatus(pulsar: Pick<Pulsar, 'toaCount' | 'latestFit'>): PulsarStatus {
  const fit = pulsar.latestFit;
  if (fit) {
    if (fit.status === 'queued') return 'fit-queued';
    if (fit.status === 'running') return 'fitting';
    if (fit.status === 'succeeded') return 'fitted';
    if (fit.status === 'failed') return 'fit-failed';
    return 'fit-cancelled';
  }
  return (pulsar.toaCount ?? 0) > 0 ? 'not-fitted' : 'no-toas';
}
