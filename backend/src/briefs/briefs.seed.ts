import { briefSchema, type BriefInput } from '@shared/schemas/briefs';
import { registerSeedStep } from '../db/seed';
import { UserRecord } from '../users/user.model';
import { BriefRecord, BriefVersionRecord } from './brief.model';

/** The demo team's briefs (invented scenario): what each product must do. */
export const DEMO_BRIEFS: BriefInput[] = [
  {
    name: 'Sideline cold compress',
    packType: 'cold',
    ambientC: 25,
    targetTempC: 5,
    reachWithinMin: 3,
    holdMin: 15,
    maxMassG: 200,
    maxUnitCost: '0.60',
    contact: 'skin-through-fabric',
    objective: 'least-cost',
    maxActives: 2,
    notes: 'Single-use compress for sports sidelines: squeeze, shake, apply over a cloth.',
  },
  {
    name: 'Medicine-carrier cold insert',
    packType: 'cold',
    ambientC: 30,
    targetTempC: 8,
    bandK: 4,
    reachWithinMin: 10,
    holdMin: 60,
    maxMassG: 400,
    maxUnitCost: '1.20',
    contact: 'insulated',
    objective: 'most-hold-margin',
    maxActives: 2,
    minSurfaceTempC: 2,
    notes: 'Keeps a small insulated medicine pouch cool on a hot day; must not freeze its contents.',
  },
  {
    name: 'Glove warmer insert',
    packType: 'warm',
    ambientC: 0,
    targetTempC: 38,
    bandK: 4,
    reachWithinMin: 15,
    holdMin: 120,
    maxMassG: 60,
    maxUnitCost: '0.40',
    contact: 'skin-through-fabric',
    objective: 'least-mass',
    maxActives: 1,
    maxSurfaceTempC: 44,
    notes: 'Slim insert for winter gloves; long, gentle warmth.',
  },
  {
    name: 'Trail-meal heater',
    packType: 'warm',
    ambientC: 10,
    targetTempC: 60,
    bandK: 10,
    reachWithinMin: 8,
    holdMin: 10,
    maxMassG: 150,
    maxUnitCost: '0.90',
    contact: 'insulated',
    objective: 'least-cost',
    maxActives: 2,
    maxSurfaceTempC: 95,
    maxGasL: 1,
    notes: 'Flameless heater under a pouch meal; handled with its sleeve, not on skin.',
  },
];

registerSeedStep(async (workspaces) => {
  const demo = workspaces.get('demo');
  if (!demo) return;
  const designer = await UserRecord.findOne({ where: { email: 'designer@demo.test' } });
  for (const input of DEMO_BRIEFS) {
    const spec = briefSchema.parse(input);
    const [brief, created] = await BriefRecord.findOrCreate({
      where: { workspaceId: demo.id, name: spec.name },
      defaults: { workspaceId: demo.id, name: spec.name, packType: spec.packType, spec, createdById: designer?.id ?? null, updatedById: designer?.id ?? null },
    });
    if (created) await BriefVersionRecord.create({ briefId: brief.id, version: 0, spec, savedById: designer?.id ?? null });
  }
});
