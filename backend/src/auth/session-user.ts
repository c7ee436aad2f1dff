import type { Role, SessionUser } from '@shared/schemas';
import type { UserRecord } from '../users/user.model';

/** What every authenticated request carries as `req.user`. */
export interface AuthUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  workspaceId: number;
  workspace: { id: number; name: string; currency: string };
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends AuthUser {}
  }
}

export function toAuthUser(user: UserRecord): AuthUser {
  if (!user.workspace) throw new Error('toAuthUser needs the workspace loaded');
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    workspaceId: user.workspaceId,
    workspace: { id: user.workspace.id, name: user.workspace.name, currency: user.workspace.currency },
  };
}

export function toSessionUser(user: AuthUser): SessionUser {
  return { id: user.id, email: user.email, name: user.name, role: user.role, workspace: user.workspace };
}
