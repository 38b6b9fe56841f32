import { NavLink } from 'react-router-dom';
import { paths } from '../config/paths';
import { PERMISSIONS } from '../config/permissions';
import { cn } from '../lib/cn';

export interface NavItem {
  label: string;
  to: string;
  /** Shown only when `me.permissions` contains this; undefined means every signed-in user. */
  permission?: string;
  end?: boolean;
}

export const NAV_ITEMS: readonly NavItem[] = [
  { label: 'Dashboard', to: paths.dashboard.href(), end: true },
  { label: 'Pulsars', to: paths.pulsars.href() },
  { label: 'Observatories', to: paths.observatories.href() },
  { label: 'Campaigns', to: paths.campaigns.href(), permission: 'campaigns:read' },
  { label: 'Users', to: paths.users.href(), permission: PERMISSIONS.manageUsers },
  { label: 'Outbox', to: paths.outbox.href(), permission: PERMISSIONS.readOutbox },
];

export function visibleNavItems(permissions: readonly string[]): NavItem[] {
  return NAV_ITEMS.filter((item) => item.permission === undefined || permissions.includes(item.permission));
}

export function AppNavigation({ permissions }: { permissions: readonly string[] }) {
  return (
    <nav aria-label="Main">
      <ul className="flex items-center gap-1">
        {visibleNavItems(permissions).map((item) => (
          <li key={item.to}>
            <NavLink
              to={item.to}
              end={item.end}
              className={({ isActive }) =>
                cn(
                  'rounded-md px-3 py-1.5 text-sm font-medium transition-colors focus-ring',
                  isActive ? 'bg-night-800 text-ember-300' : 'text-night-300 hover:bg-night-800/60 hover:text-night-100',
                )
              }
            >
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
