import { Pipe, PipeTransform } from '@angular/core';
import type { Role } from '@shared/schemas';
import { ROLE_LABELS, ROLES } from '@shared/schemas/role-names';

/** Role labels in the fixed order of ROLES, joined for reading: "Technologist, Laboratory director". */
export function roleNames(roles: readonly Role[]): string {
  return ROLES.filter((role) => roles.includes(role))
    .map((role) => ROLE_LABELS[role])
    .join(', ');
}

@Pipe({ name: 'roleNames' })
export class RoleNamesPipe implements PipeTransform {
  transform(roles: readonly Role[] | null | undefined): string {
    return roleNames(roles ?? []);
  }
}
