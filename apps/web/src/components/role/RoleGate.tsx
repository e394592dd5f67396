import type { ReactNode } from 'react';
import { roleAtLeast, useMe, type Role } from '../../lib/api';

/**
 * Shows `children` only to a signed-in user whose role reaches `role` (viewer < engineer <
 * admin, as the API's middleware checks), `otherwise` to everyone else and nothing while the
 * user is loading: a control that can only fail is not drawn at all.
 */
export function RoleGate({
  role,
  children,
  otherwise = null,
}: {
  role: Role;
  children: ReactNode;
  otherwise?: ReactNode;
}) {
  const me = useMe();
  if (!me.data) return null;
  return <>{roleAtLeast(me.data.role, role) ? children : otherwise}</>;
}
