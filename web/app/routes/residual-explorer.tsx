import { Page } from '../../components/page';

/** The residual explorer (issue 6); the full screen is being built. */
export default function ResidualExplorerRoute() {
  return <Page title="Residual explorer">Loading…</Page>;
}
