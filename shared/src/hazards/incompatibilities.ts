import { findPrecipitates, ionsFromSolutes } from '../chemistry/precipitation';
import type { ChemistryLibrary } from '../chemistry/types';
import type { IngredientHazardData } from '../schemas/hazards';
import type { IngredientProcessInput } from '../thermal/process';
import { gasesEvolved, incompatibilityNotes } from './hazard-notes';

/** One ingredient of a set, as the compatibility check reads it. */
export interface CompatibilityComponent {
  name: string;
  /** Mass in the pack, g; for a set without masses give a nominal amount (e.g. 10 g each). */
  massG: number;
  process?: IngredientProcessInput | null;
  hazardData?: IngredientHazardData | null;
}

export interface Incompatibility {
  kind: 'precipitation' | 'gas' | 'reactive';
  /** The ingredients involved, by name. */
  between: string[];
  /** The solid precipitated, the gas evolved, or the hazard rule id. */
  subject: string;
  message: string;
  source: string;
  /**
   * The pack's own chemistry by design, not a mismatch of ingredients (see {@link isIntendedReaction}):
   * the caution stands in the hazard notes, but the set is not marked incompatible for it.
   */
  intended: boolean;
}

const isWater = (c: CompatibilityComponent) => c.process?.kind === 'inert' && c.process.role === 'water';

/**
 * Whether an incompatibility is what the pack's chemistry does by design:
 * - gas from a reaction whose reactants one ingredient brings with the pack's water (magnesium
 *   + water → H2) is the brief's gas limit's business, not a mismatch; gas from a reaction that
 *   takes a reactant of another ingredient is one;
 * - `incompat.water-reactive` when every water-reactive ingredient's own process is a reaction
 *   that takes water (quicklime, magnesium);
 * - `incompat.acid-base` when the pair is one member's reaction and the partner it takes
 *   (barium hydroxide + ammonium chloride).
 * Precipitation between two ingredients' ions and the other reactive pairs never are.
 */
function isIntendedReaction(i: Omit<Incompatibility, 'intended'>, present: readonly CompatibilityComponent[]): boolean {
  if (i.kind === 'gas') {
    const p = present.find((c) => c.name === i.between[0])?.process;
    return p?.kind === 'reaction' && p.reactants.every((t) => t.key === p.ingredientKey || t.key === 'H2O(l)' || p.basis === 'premix');
  }
  if (i.kind === 'reactive' && i.subject === 'incompat.water-reactive') {
    const reactive = present.filter((c) => c.hazardData?.incompatibilityGroups.includes('water-reactive'));
    return reactive.every((c) => c.process?.kind === 'reaction' && c.process.reactants.some((t) => t.key === 'H2O(l)'));
  }
  if (i.kind === 'reactive' && i.subject === 'incompat.acid-base') {
    return present.some((r) => {
      const p = r.process;
      if (p?.kind !== 'reaction') return false;
      const takenBy = (c: CompatibilityComponent) => c === r || (c.process?.kind === 'dissolution' && p.reactants.some((t) => c.process?.kind === 'dissolution' && t.key === c.process.solidKey));
      return i.between.length > 1 && i.between.every((n) => present.some((c) => c.name === n && takenBy(c)));
    });
  }
  return false;
}

/**
 * What goes wrong when a set of ingredients meets in one pack, for the optimiser and the bench:
 * - `precipitation`: every dissolving solid taken as fully dissolved in the pack's water (charged
 *   water + hydrate water) at `tempC`; the sparingly soluble solids that then precipitate
 *   ({@link findPrecipitates}: Ksp from ΔfG°, NBS 1982), with the ingredients whose ions meet;
 * - `gas`: gas evolved by the set's reactions ({@link gasesEvolved});
 * - `reactive`: incompatible hazard groups (oxidiser + fuel, water-reactive + water, acid + base;
 *   {@link incompatibilityNotes}).
 * Components with mass 0 are left out. Each carries `intended` ({@link isIntendedReaction}).
 *
 * @example incompatibilities([{ name: 'soda', massG: 50, process: na2co3 }, { name: 'CaCl2', massG: 50, process: cacl2 }, { name: 'water', massG: 100, process: water }], lib)
 * // → [{ kind: 'precipitation', between: ['soda', 'CaCl2'], subject: 'CaCO3(cr)', … }]
 */
export function incompatibilities(components: readonly CompatibilityComponent[], lib: ChemistryLibrary, tempC = 25): Incompatibility[] {
  const present = components.filter((c) => c.massG > 0);
  const out: Omit<Incompatibility, 'intended'>[] = [];

  // Precipitation: ions from each dissolving solid, remembered by the ingredient that brings them.
  let waterG = present.filter(isWater).reduce((a, c) => a + c.massG, 0);
  const bringers = new Map<string, Set<string>>();
  const solutes: { soluteKey: string; mol: number }[] = [];
  for (const c of present) {
    const p = c.process;
    if (p?.kind !== 'dissolution') continue;
    const solid = lib.species.find((s) => s.key === p.solidKey);
    if (!solid) continue;
    const mol = c.massG / solid.molarMass_g_per_mol;
    waterG += (p.hydrateWaterPerFormula ?? 0) * mol * 18.015;
    const soluteKey = p.soluteKey ?? p.solidKey;
    solutes.push({ soluteKey, mol });
    for (const ion of Object.keys(ionsFromSolutes(lib, [{ soluteKey, mol }]).ionsMol)) {
      const set = bringers.get(ion) ?? new Set<string>();
      set.add(c.name);
      bringers.set(ion, set);
    }
  }
  if (solutes.length > 1 && waterG > 0) {
    const { ionsMol } = ionsFromSolutes(lib, solutes);
    const r = findPrecipitates(ionsMol, waterG, tempC, lib);
    for (const p of r.precipitates) {
      const between = [...new Set(Object.keys(p.ionsMol).flatMap((ion) => [...(bringers.get(ion) ?? [])]))];
      if (between.length < 2) continue; // one ingredient's own ions: its solubility data decide
      out.push({
        kind: 'precipitation',
        between,
        subject: p.solidKey,
        message: `${between.join(' and ')}: ${p.name} (${p.solidKey.replace(/\(cr\)$/, '')}) precipitates when they meet in the water (about ${p.massG.toFixed(1)} g). The pack's salts do not stay dissolved as designed.`,
        source: r.source,
      });
    }
  }

  for (const g of gasesEvolved(present.map((c) => ({ name: c.name, massG: c.massG, process: c.process ?? null })))) {
    if (!(g.mol > 0)) continue;
    out.push({ kind: 'gas', between: [g.from], subject: g.species, message: `${g.from} evolves ${g.litres.toFixed(2)} L of ${g.species.replace(/\(g\)$/, '')} (25 °C, 1 atm).`, source: 'reaction stoichiometry of the ingredient\'s process' });
  }

  for (const n of incompatibilityNotes(present.map((c) => ({ name: c.name, massG: c.massG, hazardData: c.hazardData ?? null, isWater: isWater(c) })))) {
    out.push({ kind: 'reactive', between: present.filter((c) => n.text.includes(c.name)).map((c) => c.name), subject: n.ruleId, message: n.text, source: n.source });
  }
  return out.map((i) => ({ ...i, intended: isIntendedReaction(i, present) }));
}
