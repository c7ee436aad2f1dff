/**
 * The four roles of a workspace member (DESIGN.md §1), without zod, so the first screen's error
 * page can know them without loading the schema library (common.ts builds `roleSchema` on them).
 */
export const ROLES = ['designer', 'chemist', 'reviewer', 'admin'] as const;

export type RoleName = (typeof ROLES)[number];

export const ROLE_LABELS: Record<RoleName, string> = {
  designer: 'Product designer',
  chemist: 'Chemist',
  reviewer: 'Regulatory reviewer',
  admin: 'Administrator',
};
