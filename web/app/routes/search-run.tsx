import { Page } from '../../components/page';

/** Placeholder while the search-run screen is built. */
export default function SearchRunRoute() {
  return <Page title="Companion search">{null}</Page>;
}
