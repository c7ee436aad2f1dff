import type { ChemistryLibrary } from '../chemistry/types';
import { resolvedMixtureSchema, type EvaluateMixtureResponse, type ResolvedMixture } from '../schemas/mixtures';
import type { ChemistryPort } from '../thermal/chemistry-port';
import { ThermalModelError } from '../thermal/errors';
import { evaluate } from './evaluate';

/**
 * The computation behind POST /api/mixtures/evaluate: the time profile of a resolved mixture
 * (every component carries its process) under its contact case or UA, and its adiabatic end
 * state. With `uaWPerK: 0` and `packHeatCapacityJPerK: 0` the profile is adiabatic and, once
 * the processes have run, ends at `adiabaticEndTempC`.
 *
 * Runs through the evaluation core ({@link evaluate}).
 *
 * Throws ThermalModelError (with `field`) when the input breaks the schema or the model.
 *
 * @example evaluateMixture(port, { components: [{ key: 'water', massG: 100, process: { kind: 'inert', role: 'water' } },
 *   { key: 'NH4NO3', massG: 40, process: { kind: 'dissolution', solidKey: 'NH4NO3(cr)' } }],
 *   initialTempC: 25, ambientC: 25, uaWPerK: 0, packHeatCapacityJPerK: 0, holdMin: 20 }).endTempC // ≈ 2.6
 */
export function evaluateMixture(chemistry: ChemistryPort | ChemistryLibrary, input: ResolvedMixture): EvaluateMixtureResponse {
  const parsed = resolvedMixtureSchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new ThermalModelError(`expected a valid mixture: ${issue?.message ?? 'invalid input'}`, {
      field: issue?.path.join('.') ?? '',
    });
  }
  const m = parsed.data;
  const ev = evaluate({
    lines: m.components.map((c, k) => ({ id: c.key ?? c.formula ?? `component ${k + 1}`, name: c.key ?? c.formula ?? `component ${k + 1}`, ...(c.formula ? { formula: c.formula } : {}), massG: c.massG, process: c.process })),
    conditions: {
      initialTempC: m.initialTempC,
      ambientC: m.ambientC,
      exchange: m.contact ? { contact: m.contact } : { uaWPerK: m.uaWPerK ?? 0 },
      packHeatCapacityJPerK: m.packHeatCapacityJPerK,
      ...(!m.contact && m.packAreaM2 !== undefined ? { packAreaM2: m.packAreaM2 } : {}),
      horizonMin: m.holdMin,
      ...(m.targetTempC !== undefined ? { targetTempC: m.targetTempC } : {}),
      ...(m.targetBand ? { targetBand: m.targetBand } : {}),
      ...(m.load ? { load: m.load } : {}),
    },
    chemistry,
    options: { endState: true },
  });
  const { model, profile } = ev;
  const massG = ev.massG;
  const { uaWPerK, envTempC, areaM2 } = ev.exchange;
  const end = ev.endState!;

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
    timeToTargetMin: ev.figures.timeToTargetMin,
    minutesInBand: ev.figures.minutesInBand,
    massG,
    uaWPerK,
    envTempC,
    areaM2,
    energy: profile.energy,
    warnings: model.warnings.list(),
    load: ev.figures.load,
  };
}
