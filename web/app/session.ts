import type { QueryClient } from '@tanstack/react-query';
import { redirect } from 'react-router-dom';
import { paths } from '../config/paths';
import { isApiError } from '../lib/api-client';
import { meQueryOptions, type Me } from '../features/auth/api/get-me';

/**
 * For route loaders of signed-in pages: resolves with the session (cached or `GET /api/auth/me`),
 * or throws a redirect to sign-in that remembers where the user wanted to go.
 */
export async function requireSession(queryClient: QueryClient, request: Request): Promise<Me> {
  try {
    return await queryClient.ensureQueryData(meQueryOptions());
  } catch (error) {
    if (isApiError(error) && error.status === 401) {
      const url = new URL(request.url);
      throw redirect(paths.signIn.href(url.pathname + url.search));
    }
    throw error;
  }
}

export function hasPermission(me: Me | undefined, permission: string): boolean {
  return me?.permissions.includes(permission) ?? false;
}
