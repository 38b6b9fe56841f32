// The permissions the companion-search screens check, typed against the API's one table
// (api/auth/permissions.ts) so a rename fails the type check instead of hiding a button.
import type { Permission } from '../../../../api/auth/permissions';

export const SEARCH_PERMISSIONS = {
  runSearches: 'searches:run',
  editModels: 'models:edit',
  runFits: 'fits:run',
} as const satisfies Record<string, Permission>;
