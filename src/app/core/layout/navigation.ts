import type { Role } from '@shared/schemas';

/** One entry of the side navigation. Features add theirs to NAVIGATION; the shell shows what roles allow. */
export interface NavItem {
  /** Stable id: the entry's data-testid is `nav-${id}`. */
  id: string;
  label: string;
  /** A Material Icons ligature name. */
  icon: string;
  path: string;
  /** Who sees it; the route's guard checks the same roles. */
  roles: readonly Role[];
  /** A heading the entry sits under, e.g. 'Admin'. */
  group?: string;
  /** One sentence on what the page is for; the worklist's welcome card lists it. */
  description: string;
}

const EVERYONE: readonly Role[] = ['technologist', 'director', 'quality', 'admin'];
const ADMIN: readonly Role[] = ['admin'];

export const NAVIGATION: readonly NavItem[] = [
  { id: 'worklist', label: 'Worklist', icon: 'inbox', path: '/', roles: EVERYONE, description: 'Your starting page.' },
  {
    id: 'studies', label: 'Studies', icon: 'compare_arrows', path: '/studies', roles: ['technologist', 'director', 'quality'],
    description: 'Find, open and start method studies: their setup, specimens and findings.',
  },
  {
    id: 'releases', label: 'Releases', icon: 'rocket_launch', path: '/releases', roles: ['technologist', 'director', 'quality'],
    description: 'Release a changed method for patient testing: the studies each change needs, waivers and the director’s signature.',
  },
  {
    id: 'archive', label: 'Archive', icon: 'inventory_2', path: '/archive', roles: ['director', 'quality'],
    description: 'Search every study of the laboratory and read its audit record: signatures, re-checks and history.',
  },
  {
    id: 'history', label: 'History', icon: 'manage_history', path: '/history', roles: ['director', 'quality'],
    description: 'Read everything recorded in the laboratory: sign-ins, study steps, signatures and re-checks.',
  },
  {
    id: 'profile', label: 'Profile', icon: 'account_circle', path: '/profile', roles: EVERYONE,
    description: 'See your account and change your password.',
  },
  {
    id: 'users', label: 'Users', icon: 'group', path: '/admin/users', roles: ADMIN, group: 'Admin',
    description: 'Invite people, give them roles, unlock or deactivate accounts.',
  },
  {
    id: 'analytes', label: 'Analytes', icon: 'science', path: '/admin/analytes', roles: ADMIN, group: 'Admin',
    description: 'Keep the analyte catalog: units, decision levels and allowable bias with its source.',
  },
  {
    id: 'instruments', label: 'Instruments', icon: 'precision_manufacturing', path: '/admin/instruments', roles: ADMIN,
    group: 'Admin', description: 'Keep the list of instruments: model, serial number and location.',
  },
  {
    id: 'release-templates', label: 'Release templates', icon: 'checklist', path: '/admin/release-templates', roles: ADMIN, group: 'Admin',
    description: 'Set which studies each kind of change needs before release, and when each method is due for re-verification.',
  },
  {
    id: 'mailbox', label: 'Mailbox', icon: 'mail', path: '/admin/mailbox', roles: ADMIN, group: 'Admin',
    description: 'Read the e-mails Parallax has sent, such as invitations.',
  },
  {
    id: 'laboratory', label: 'Laboratory', icon: 'tune', path: '/admin/laboratory', roles: ADMIN, group: 'Admin',
    description: 'Set the laboratory’s time zone and its sign-off rules: plan approval before data, one-person laboratory.',
  },
];

/** The entries a user with `roles` may open, in their defined order. */
export function navigationFor(roles: readonly Role[], items: readonly NavItem[] = NAVIGATION): NavItem[] {
  return items.filter((item) => item.roles.some((role) => roles.includes(role)));
}

export interface NavSection {
  group: string | null;
  items: NavItem[];
}

/** Consecutive entries with the same group form one section (ungrouped entries form a section too). */
export function sectionsOf(items: readonly NavItem[]): NavSection[] {
  const sections: NavSection[] = [];
  for (const item of items) {
    const group = item.group ?? null;
    const last = sections.at(-1);
    if (last && last.group === group) last.items.push(item);
    else sections.push({ group, items: [item] });
  }
  return sections;
}
