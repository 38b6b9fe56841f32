/**
 * The iterative companion search (implementation in progress; the signature is final).
 */
import type { TimingModel } from '../model/timing-model';
import type { Toa } from '../toas/toa';
import type { ArrivalGeometry } from '../pipeline/arrival-geometry';
import type { CompanionSearchOptions, CompanionSearchReport } from './companion-search-report';

export function searchCompanions(model: TimingModel, toas: readonly Toa[], geometry: ArrivalGeometry, options: CompanionSearchOptions = {}): CompanionSearchReport {
  void model; void toas; void geometry; void options;
  throw new Error('searchCompanions: not implemented yet');
}
