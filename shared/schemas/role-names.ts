/** The four roles of Parallax; a user may hold several. No zod here, so the shell can import it cheaply. */
export const ROLES = ['technologist', 'director', 'quality', 'admin'] as const;
export type RoleName = (typeof ROLES)[number];

export const ROLE_LABELS: Record<RoleName, string> = {
  technologist: 'Technologist',
  director: 'Laboratory director',
  quality: 'Quality officer',
  admin: 'Administrator',
};
