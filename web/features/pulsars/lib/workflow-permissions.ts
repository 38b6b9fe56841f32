// The data-workflow permissions the pulsar and fit-run pages check, typed against the API's one
// table (api/auth/permissions.ts) so a rename fails the type check instead of hiding a button.
import type { Permission } from '../../../../api/auth/permissions';

export const WORKFLOW_PERMISSIONS = {
  uploadToas: 'toas:upload',
  editModels: 'models:edit',
  runFits: 'fits:run',
  deleteToaBatches: 'toa-batches:delete',
} as const satisfies Record<string, Permission>;
