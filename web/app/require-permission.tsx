import type { ReactNode } from 'react';
import { Alert } from '../components/alert';
import { useMe } from '../features/auth/api/get-me';
import { hasPermission } from './session';

/** Renders `children` only for users whose session lists `permission`; others see why not. */
export function RequirePermission({ permission, children }: { permission: string; children: ReactNode }) {
  const me = useMe();
  if (!hasPermission(me.data, permission)) {
    return (
      <Alert tone="error" title="Not available for your role">
        This page needs the “{permission}” permission. Ask an administrator if you need it.
      </Alert>
    );
  }
  return <>{children}</>;
}
