import { z } from 'zod';

/** The four roles of Parallax; a user may hold several. */
export const ROLES = ['technologist', 'director', 'quality', 'admin'] as const;
export const Role = z.enum(ROLES);
export type Role = z.infer<typeof Role>;

export const ROLE_LABELS: Record<Role, string> = {
  technologist: 'Technologist',
  director: 'Laboratory director',
  quality: 'Quality officer',
  admin: 'Administrator',
};
