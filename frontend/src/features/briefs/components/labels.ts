import type { ContactCase, LoadKind, Objective, PackType } from '@shared/schemas/briefs';

export const PACK_TYPE_NAMES: Record<PackType, string> = { cold: 'Cold pack', warm: 'Warm pack' };

export const CONTACT_NAMES: Record<ContactCase, string> = {
  'still-air': 'In still air',
  'skin-through-fabric': 'On skin, through fabric',
  insulated: 'Inside insulation',
};

export const OBJECTIVE_NAMES: Record<Objective, string> = {
  'least-cost': 'Least cost',
  'least-mass': 'Least mass',
  'most-hold-margin': 'Most hold margin',
};

export const LOAD_KIND_NAMES: Record<LoadKind, string> = {
  'food-drink': 'A meal or a drink',
  'limb-through-fabric': 'A limb, through fabric',
  'cold-chain-box': 'The contents of a cold-chain box',
};
