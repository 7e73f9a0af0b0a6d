import type { Role } from '@shared/schemas';
import { ROLE_LABELS, ROLES } from '@shared/schemas/roles';

/** What each role is for in a laboratory using Parallax, in one sentence. */
export const ROLE_DUTIES: Record<Role, string> = {
  technologist: 'Enters the paired specimen results of method studies and submits them for sign-off.',
  director: 'Reviews submitted studies and signs them electronically as accepted or not accepted.',
  quality: 'Audits archived studies, their findings and their history.',
  admin: 'Keeps the users, the analyte catalog and the instruments of the laboratory.',
};

export interface RoleDuty {
  role: Role;
  label: string;
  duty: string;
}

/** The user's roles in the fixed order of ROLES, each with its label and duty. */
export function dutiesOf(roles: readonly Role[]): RoleDuty[] {
  return ROLES.filter((role) => roles.includes(role)).map((role) => ({
    role,
    label: ROLE_LABELS[role],
    duty: ROLE_DUTIES[role],
  }));
}
