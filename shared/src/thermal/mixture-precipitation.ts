import { findPrecipitates, ionsFromSolutes, type PrecipitationResult } from '../chemistry/precipitation';
import type { ChemistryLibrary } from '../chemistry/types';
import { WATER_MOLAR_MASS_G_PER_MOL } from './constants';
import { ingredientProcessSchema } from './process';
import type { ThermalComponent } from './pack-model';

/**
 * What precipitates in an evaluated mixture: the dissolved amount of each dissolving component
 * (its mass ÷ molar mass × the dissolved fraction the evaluation found, in component order),
 * split into ions, in the liquid water at the end (charged water + released hydrate water − ice),
 * at the end temperature; then {@link findPrecipitates}. The heat of precipitation is reported,
 * not yet part of the time curve.
 *
 * @example mixturePrecipitation(lib, components, { solutes, iceG: 0, endTempC: 12 }).precipitates[0]?.solidKey // → 'CaCO3(cr)'
 */
export function mixturePrecipitation(
  lib: ChemistryLibrary,
  components: readonly ThermalComponent[],
  result: { solutes: readonly { dissolvedFraction: number }[]; iceG: number; endTempC: number },
): PrecipitationResult {
  let waterG = -result.iceG;
  const solutes: { soluteKey: string; mol: number }[] = [];
  let j = 0;
  for (const c of components) {
    const p = ingredientProcessSchema.safeParse(c.process);
    if (!p.success) continue;
    const d = p.data;
    if (d.kind === 'inert' && d.role === 'water') waterG += c.massG;
    if (d.kind !== 'dissolution') continue;
    const solid = lib.species.find((s) => s.key === d.solidKey);
    const f = result.solutes[j++]?.dissolvedFraction ?? 0;
    if (!solid) continue;
    const mol = (c.massG / solid.molarMass_g_per_mol) * f;
    waterG += d.hydrateWaterPerFormula * mol * WATER_MOLAR_MASS_G_PER_MOL;
    solutes.push({ soluteKey: d.soluteKey ?? d.solidKey, mol });
  }
  const { ionsMol, warnings } = ionsFromSolutes(lib, solutes);
  const r = findPrecipitates(ionsMol, Math.max(0, waterG), result.endTempC, lib);
  return { ...r, warnings: [...warnings, ...r.warnings] };
}
