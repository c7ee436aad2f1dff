import { resolvedMixtureSchema, type EvaluateMixtureResponse, type ResolvedMixture } from '../schemas/mixtures';
import type { ChemistryPort } from './chemistry-port';
import { contactUA } from './contact';
import { solveModelEndState } from './end-state';
import { ThermalModelError } from './errors';
import { PackModel } from './pack-model';
import { simulateModel } from './time-profile';

/**
 * The computation behind POST /api/mixtures/evaluate: the time profile of a resolved mixture
 * (every component carries its process) under its contact case or UA, and its adiabatic end
 * state. With `uaWPerK: 0` and `packHeatCapacityJPerK: 0` the profile is adiabatic and, once
 * the processes have run, ends at `adiabaticEndTempC`.
 *
 * Throws ThermalModelError (with `field`) when the input breaks the schema or the model.
 *
 * @example evaluateMixture(port, { components: [{ key: 'water', massG: 100, process: { kind: 'inert', role: 'water' } },
 *   { key: 'NH4NO3', massG: 40, process: { kind: 'dissolution', solidKey: 'NH4NO3(cr)' } }],
 *   initialTempC: 25, ambientC: 25, uaWPerK: 0, packHeatCapacityJPerK: 0, holdMin: 20 }).endTempC // ≈ 2.6
 */
export function evaluateMixture(port: ChemistryPort, input: ResolvedMixture): EvaluateMixtureResponse {
  const parsed = resolvedMixtureSchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new ThermalModelError(`expected a valid mixture: ${issue?.message ?? 'invalid input'}`, {
      field: issue?.path.join('.') ?? '',
    });
  }
  const m = parsed.data;
  const massG = m.components.reduce((a, c) => a + c.massG, 0);
  let uaWPerK: number;
  let envTempC = m.ambientC;
  let areaM2: number | null = m.packAreaM2 ?? null;
  if (m.contact) {
    const c = contactUA(m.contact, m.ambientC, massG);
    uaWPerK = c.uaWPerK;
    envTempC = c.envTempC;
    areaM2 = c.areaM2;
  } else uaWPerK = m.uaWPerK ?? 0;

  const model = new PackModel(
    port,
    m.components.map((c) => ({ ...(c.key ? { key: c.key } : {}), ...(c.formula ? { formula: c.formula } : {}), massG: c.massG, process: c.process })),
    { packHeatCapacityJPerK: m.packHeatCapacityJPerK, ...(areaM2 !== null ? { packAreaM2: areaM2 } : {}) },
  );
  const profile = simulateModel(model, {
    initialTempC: m.initialTempC,
    envTempC,
    uaWPerK,
    holdMin: m.holdMin,
    ...(m.targetTempC !== undefined ? { targetTempC: m.targetTempC } : {}),
    ...(m.targetBand ? { targetBand: m.targetBand } : {}),
  });
  const end = solveModelEndState(model, m.initialTempC, 0, { outOfRange: 'limit' });

  let dissolvingMass = 0;
  let dissolvedMass = 0;
  model.solutes.forEach((s, j) => {
    const g = s.availableMol * s.solidMolarMass;
    dissolvingMass += g;
    dissolvedMass += g * (profile.solutes[j]?.dissolvedFraction ?? 0);
  });
  return {
    endTempC: profile.endTempC,
    minTempC: profile.minTempC,
    maxTempC: profile.maxTempC,
    adiabaticEndTempC: end.endTempC,
    dissolvedFraction: dissolvingMass > 0 ? dissolvedMass / dissolvingMass : 1,
    solutes: profile.solutes.map((s) => ({ key: s.label, soluteKey: s.soluteKey, dissolvedFraction: s.dissolvedFraction, limitedBy: s.limitedBy })),
    iceG: profile.iceG,
    curve: profile.curve,
    timeToTargetMin: profile.timeToTargetMin,
    minutesInBand: profile.minutesInBand,
    massG,
    uaWPerK,
    envTempC,
    areaM2,
    energy: profile.energy,
    warnings: model.warnings.list(),
  };
}
