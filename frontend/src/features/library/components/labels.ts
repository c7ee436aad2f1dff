import type { IngredientRole } from '@shared/schemas/library';
import type { ProcessKind } from '@shared/thermal/process';

export const ROLE_NAMES: Record<IngredientRole, string> = {
  active: 'Active',
  solvent: 'Solvent',
  additive: 'Additive',
  packaging: 'Packaging',
};

export const PROCESS_NAMES: Record<ProcessKind, string> = {
  dissolution: 'Dissolution',
  reaction: 'Reaction / hydration',
  crystallisation: 'Crystallisation',
  'air-oxidation': 'Air oxidation',
  inert: 'Inert (heat capacity)',
};
