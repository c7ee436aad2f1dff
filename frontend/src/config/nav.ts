import { ROLES, type Role } from '@shared/schemas/common';

/**
 * Navigation, per role. A feature that adds a page adds one entry here (and its route in
 * app/router.tsx); the header and the home page's quick links both read this list.
 * Only list pages that exist.
 */
export type NavItem = {
  /** Route path, e.g. '/briefs'. */
  to: string;
  label: string;
  /** One line for the home page's quick links. */
  description: string;
  roles: readonly Role[];
  /** Match the path exactly (for '/'). */
  end?: boolean;
  /** Shown on the home page's quick links (home itself is not). */
  quickLink?: boolean;
};

const EVERYONE = ROLES;

export const NAV_ITEMS: readonly NavItem[] = [
  { to: '/', label: 'Home', description: 'What is waiting for you.', roles: EVERYONE, end: true, quickLink: false },
  {
    to: '/briefs',
    label: 'Briefs',
    description: 'Thermal targets and limits; run the optimiser and weigh its candidates.',
    roles: EVERYONE,
    quickLink: true,
  },
  {
    to: '/reviews',
    label: 'Reviews',
    description: 'Candidates waiting for your review or revision, and their dossiers.',
    roles: EVERYONE,
    quickLink: true,
  },
  {
    to: '/library',
    label: 'Ingredient library',
    description: 'Ingredients with their grades, costs, processes, sources and safety data sheets.',
    roles: EVERYONE,
    quickLink: true,
  },
  {
    to: '/lab-logs',
    label: 'Lab logs',
    description: 'Recorded temperature curves against the prediction; calibrate the model.',
    roles: ['chemist', 'admin'],
    quickLink: true,
  },
  {
    to: '/species',
    label: 'Species data',
    description: 'Enthalpies of formation, entropies and heat capacities behind every calculation.',
    roles: EVERYONE,
    quickLink: true,
  },
  {
    to: '/bench',
    label: 'Mixture bench',
    description: 'Try a mixture and watch its temperature over the hold, as you type.',
    roles: EVERYONE,
    quickLink: true,
  },
  {
    to: '/reactions',
    label: 'Reactions',
    description: 'Heat per gram, how hot the pack gets, the gas it makes, and whether it starts by itself.',
    roles: EVERYONE,
    quickLink: true,
  },
  {
    to: '/admin/users',
    label: 'People',
    description: 'Invite members, set their roles, disable accounts.',
    roles: ['admin'],
    quickLink: true,
  },
  {
    to: '/admin/mail',
    label: 'Mail sink',
    description: 'Messages Packwright has sent from this workspace (local mail sink).',
    roles: ['admin'],
    quickLink: true,
  },
];

export function navForRole(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.includes(role));
}

/** The same list keyed by role, for reading at a glance. */
export const NAV_BY_ROLE: Readonly<Record<Role, NavItem[]>> = Object.fromEntries(
  ROLES.map((role) => [role, navForRole(role)]),
) as Record<Role, NavItem[]>;

export function quickLinksForRole(role: Role): NavItem[] {
  return navForRole(role).filter((item) => item.quickLink !== false);
}
