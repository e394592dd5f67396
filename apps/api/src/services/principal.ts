import type { Role } from '../models/index.js';

/** Who is calling: the user, the team they act in, and the role in force for this request. */
export interface Principal {
  user: { id: string; email: string; name: string };
  teamId: string;
  teamName: string;
  /** For an API key, the lower of the key's role and the owner's current role. */
  role: Role;
  authMethod: 'session' | 'api-key';
  /** The session's or the key's id. */
  credentialId: string;
}

const RANK: Record<Role, number> = { viewer: 0, engineer: 1, admin: 2 };

export function roleAtLeast(role: Role, required: Role): boolean {
  return RANK[role] >= RANK[required];
}

export function lowerRole(a: Role, b: Role): Role {
  return RANK[a] <= RANK[b] ? a : b;
}
