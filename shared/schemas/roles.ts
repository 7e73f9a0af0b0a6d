import * as z from 'zod';
import { ROLES } from './role-names';

export { ROLE_LABELS, ROLES } from './role-names';
export const Role = z.enum(ROLES);
export type Role = z.infer<typeof Role>;
