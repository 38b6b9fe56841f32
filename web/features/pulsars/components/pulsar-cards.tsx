import { Link } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { formatCount, formatDateTimeUtc, formatMjd } from '../../../lib/format';
import type { Pulsar } from '../api/get-pulsars';

function LatestFitLine({ fit }: { fit: Pulsar['latestFit'] }) {
  if (!fit) return <dd className="text-night-300">no fit yet</dd>;
  if (fit.status !== 'succeeded') return <dd className="text-night-200">{fit.status === 'running' ? 'fitting…' : `fit ${fit.status}`}</dd>;
  return (
    <dd className="font-mono text-night-200">
      χ²/dof {fit.reducedChi2 === null ? '—' : fit.reducedChi2.toPrecision(3)} · RMS{' '}
      {fit.weightedRmsUs === null ? '—' : `${fit.weightedRmsUs.toPrecision(3)} µs`}
      {fit.finishedAt ? <span className="block font-sans text-xs text-night-400">{formatDateTimeUtc(fit.finishedAt)}</span> : null}
    </dd>
  );
}

/** Dashboard overview: one card per pulsar with its TOA count, time span, observatories and latest fit. */
export function PulsarCards({ pulsars }: { pulsars: Pulsar[] }) {
  return (
    <ul className="grid grid-cols-1 gap-4 sm:grid-cols-2 xl:grid-cols-3" aria-label="Pulsars">
      {pulsars.map((p) => (
        <li key={String(p.id)}>
          <Link
            to={paths.pulsar.href(String(p.id))}
            className="block rounded-xl border border-night-700 bg-night-900/80 p-5 transition-colors hover:border-ember-500/60"
          >
            <p className="font-mono text-lg font-semibold text-night-100">{p.name}</p>
            <p className="mt-0.5 font-mono text-xs text-night-400">
              {p.raHms} {p.decDms}
            </p>
            <dl className="mt-4 grid grid-cols-2 gap-3 text-sm">
              <div>
                <dt className="text-xs text-night-400">TOAs</dt>
                <dd className="font-mono text-ember-300 tabular-nums">{formatCount(p.toaCount)}</dd>
              </div>
              <div>
                <dt className="text-xs text-night-400">Observatories</dt>
                <dd className="truncate text-night-200">{p.observatories.length ? p.observatories.join(', ') : '—'}</dd>
              </div>
              <div className="col-span-2">
                <dt className="text-xs text-night-400">Time span (MJD)</dt>
                <dd className="font-mono text-night-200">
                  {p.firstMjd === null ? 'no TOAs yet' : `${formatMjd(p.firstMjd)} – ${formatMjd(p.lastMjd)}`}
                </dd>
              </div>
              <div className="col-span-2">
                <dt className="text-xs text-night-400">Latest fit</dt>
                <LatestFitLine fit={p.latestFit} />
              </div>
            </dl>
          </Link>
        </li>
      ))}
    </ul>
  );
}
