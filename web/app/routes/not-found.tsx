import { EmptyState } from '../../components/empty-state';
import { TextLink } from '../../components/text-link';
import { paths } from '../../config/paths';

export default function NotFoundRoute() {
  return (
    <EmptyState title="Page not found">
      Nothing lives at this address. <TextLink to={paths.dashboard.href()}>Back to the dashboard</TextLink>.
    </EmptyState>
  );
}
