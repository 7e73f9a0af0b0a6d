import type { Role } from '@shared/schemas';
import type { Actor } from '../audit/audit';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User { id: number; laboratoryId: number; name: string; email: string; roles: Role[] }
  }
}

export type SignedInUser = Express.User;

export const actorOf = (u: SignedInUser): Actor => ({ id: u.id, name: u.name, laboratoryId: u.laboratoryId });
