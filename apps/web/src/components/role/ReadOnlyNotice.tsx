import { roleAtLeast, useMe, type Role } from '../../lib/api';

/**
 * The banner a signed-in user below `role` sees on a page whose changes need that role: their
 * role, what they can do on the page (`can`), and what needs the higher role (`needs`). The page
 * hides the controls themselves (RoleGate), so the banner never offers what cannot happen.
 */
export function ReadOnlyNotice({
  role = 'engineer',
  can,
  needs,
}: {
  role?: Role;
  can: string;
  needs: string;
}) {
  const me = useMe();
  if (!me.data || roleAtLeast(me.data.role, role)) return null;
  return (
    <p
      className="mb-4 rounded-md border border-rule bg-panel px-3 py-2 text-sm"
      role="note"
      data-testid="read-only"
    >
      You have the <strong>{me.data.role}</strong> role: {can}. {needs} the {role} role; an admin of
      your team can change your role.
    </p>
  );
}
