import type { FieldOption } from '../../../components/ui/Field';
import type { Role } from '../../../lib/api';

/** The team roles, lowest first, with what each may do (the API's x-pulsewright-role rules). */
export const ROLE_OPTIONS: readonly FieldOption<Role>[] = [
  { value: 'viewer', label: 'Viewer (read, compute)' },
  { value: 'engineer', label: 'Engineer (also edit, upload)' },
  { value: 'admin', label: 'Admin (also team, keys, audit)' },
];
