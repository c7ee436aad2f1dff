import type { ComputationWarning } from '../chemistry/types';
import type { ChemistryPort } from './chemistry-port';
import { FALLBACK_SOLID_CP_J_PER_GK, REFERENCE_TEMP_C, WATER_CP_J_PER_GK, WATER_MOLAR_MASS_G_PER_MOL } from './constants';
import { ThermalModelError } from './errors';
import type { IngredientProcess, ReactionProcess } from './process';

/**
 * Reactions take their reactants from what is in the pack.
 *
 * Components whose processes are the same reaction (the same reactants and products) are one
 * reaction: a partner listed as its own ingredient with that reaction is counted once. Each
 * non-water reactant is supplied by the reaction's own components (their `ingredientKey`, or
 * all reactants in ratio for `basis: 'premix'`) and by any dissolving component whose solid is
 * that species (its mass then goes to the reaction first; what is left dissolves). The extent
 * is limited by the scarcest reactant, ξ_max = min_r (n_r / ν_r); water is limited while the
 * pack runs (pack-model.ts). A reactant no component brings stops the reaction (ξ_max = 0) and
 * says so; what a reaction does not use stays in the pack as an inert solid (Cp° from the data).
 *
 * Product phases by the data and the conditions: a gas product with an aqueous species in the
 * data dissolves in the pack's liquid water (charged water plus the reaction's own, at full
 * extent) up to its Henry's-law solubility at 1 bar, k_H = exp(−(ΔfG°(aq) − ΔfG°(g)) / RT)
 * mol/(kg·bar) (NBS 1982 ΔfG°; Atkins, Physical Chemistry, §5.3); the rest leaves as gas. NH3
 * (k_H ≈ 58 mol/(kg·bar)) stays dissolved, H2 (≈ 8e-4) leaves. An aqueous product with no
 * liquid water in the pack leaves as gas when the data have the gas. A reaction given with its
 * own dH_kJ_per_mol keeps its products as written.
 */

/** One reaction as the pack model runs it (per mol of reaction extent). */
export interface ReactionModel {
  label: string;
  maxExtentMol: number;
  /** Net mol of liquid water consumed per mol of reaction (negative: produced). */
  waterPerExtent: number;
  dH_kJ_per_mol: number;
  countedReactantMassPerExtentG: number;
  countedReactantCpPerExtent: number;
  productMassPerExtentG: number;
  productCpPerExtent: number;
  gasMassPerExtentG: number;
  gasMolPerExtent: number;
  /** Mass of reactants assumed drawn from outside per mol (only with `partners: 'assumed'`), g. */
  externalReactantMassPerExtentG: number;
  kPerS: number;
}

/** A component as the reaction set-up reads it, its process already parsed. */
export interface ReactionSetupComponent {
  label: string;
  massG: number;
  process: IngredientProcess;
  /** Field path of the component for errors, e.g. `components.2`. */
  field: string;
}

export interface ReactionSetup {
  reactions: ReactionModel[];
  /** Mass of each component left for its own process after the reactions took theirs, g (same order). */
  massLeftG: number[];
  /** What reactions leave unused (their own ingredients beyond the limiting reactant), as inert solids. */
  leftovers: { label: string; massG: number; cpJPerGK: number }[];
  warnings: { warning: ComputationWarning; subject: string }[];
}

const R_J_PER_MOL_K = 8.314462618; // CODATA 2018
const isWater = (key: string) => key === 'H2O(l)';
const phaseOf = (key: string) => /\((cr|l|g|aq|ai|ao)\)$/.exec(key)?.[1] ?? null;
const formulaOf = (key: string) => key.replace(/\((cr|l|g|aq|ai|ao)\)$/, '');

/** Two reaction processes with the same signature are one reaction (their reactants and products as written). */
export function reactionSignature(p: ReactionProcess): string {
  const side = (ts: readonly { key: string; coef: number }[]) => ts.map((t) => `${t.coef}*${t.key}`).sort().join('+');
  return `${side(p.reactants)}=${side(p.products)}`;
}

/**
 * Whether a component with this process brings reactant `key` to the reaction of signature `sig`:
 * a dissolving solid of that species, or a (non-premix) member of the same reaction whose own
 * reactant it is. The time model (below) and the linear model's partner rows use this one rule.
 */
export function suppliesReactant(process: IngredientProcess | null | undefined, key: string, sig: string): boolean {
  if (process?.kind === 'dissolution') return process.solidKey === key;
  return process?.kind === 'reaction' && process.basis !== 'premix' && process.ingredientKey === key && reactionSignature(process) === sig;
}

/**
 * The reactions of a pack, their partners taken from its components (see the module comment).
 *
 * @example setUpReactions(port, [ba(32 g), nh4cl(10.85 g as dissolution), water(0 g)])
 * // → reactions: [{ maxExtentMol ≈ 0.1014, … }], massLeftG: [0, ≈0, 0]
 */
export function setUpReactions(
  port: ChemistryPort,
  components: readonly ReactionSetupComponent[],
  waterChargedG: number,
  /** `assumed`: a reactant no component brings is taken as present in excess (per-gram coefficients of one ingredient). */
  partners: 'from-pack' | 'assumed' = 'from-pack',
): ReactionSetup {
  const warnings: ReactionSetup['warnings'] = [];
  const massLeftG = components.map((c) => c.massG);
  const leftovers: ReactionSetup['leftovers'] = [];
  const reactions: ReactionModel[] = [];
  const M = (key: string) => port.molarMass_g_per_mol(key);
  const cpOf = (key: string, coef: number) => {
    const cp = port.heatCapacity_J_per_mol_K(key);
    if (cp !== null) return coef * cp;
    const aqueous = phaseOf(key) === 'aq' || phaseOf(key) === 'ao' || phaseOf(key) === 'ai';
    // Assumption: a dissolved product without Cp° adds heat capacity like the water it is in.
    if (aqueous) return coef * M(key) * WATER_CP_J_PER_GK;
    warnings.push({ warning: { code: 'thermal.solid-cp-assumed', message: `no Cp° for ${key}; ${FALLBACK_SOLID_CP_J_PER_GK} J/(g·K) assumed` }, subject: key });
    return coef * M(key) * FALLBACK_SOLID_CP_J_PER_GK;
  };

  // Group the reaction components by reaction.
  const groups = new Map<string, number[]>();
  components.forEach((c, i) => {
    if (c.process.kind !== 'reaction') return;
    const p = c.process;
    if (!p.reactants.some((t) => t.key === p.ingredientKey)) {
      throw new ThermalModelError(`expected ingredientKey ${p.ingredientKey} among the reactants, found ${p.reactants.map((t) => t.key).join(', ')}`, { field: `${c.field}.process.ingredientKey` });
    }
    const sig = reactionSignature(p);
    groups.set(sig, [...(groups.get(sig) ?? []), i]);
  });

  for (const [sig, members] of groups) {
    const first = components[members[0]!]!;
    const p = first.process as ReactionProcess;
    const label = members.map((i) => components[i]!.label).join(' + ');
    const reactants = p.reactants.filter((t) => !isWater(t.key));

    // Supply of each reactant, mol, with who supplies it.
    const supply = new Map<string, { i: number; mol: number }[]>();
    const add = (key: string, i: number, mol: number) => supply.set(key, [...(supply.get(key) ?? []), { i, mol }]);
    let premixExtent = 0;
    for (const i of members) {
      const c = components[i]!;
      const q = c.process as ReactionProcess;
      if (q.basis === 'premix') {
        const perExtent = reactants.reduce((a, t) => a + t.coef * M(t.key), 0);
        premixExtent += perExtent > 0 ? c.massG / perExtent : 0;
      } else add(q.ingredientKey, i, c.massG / M(q.ingredientKey));
    }
    components.forEach((c, i) => {
      if (c.process.kind === 'dissolution' && reactants.some((t) => suppliesReactant(c.process, t.key, sig)) && massLeftG[i]! > 0) {
        add(c.process.solidKey, i, massLeftG[i]! / M(c.process.solidKey));
      }
    });

    let maxExtent = Number.POSITIVE_INFINITY;
    const missing: string[] = [];
    const external = new Set<string>();
    for (const t of reactants) {
      const mol = (supply.get(t.key) ?? []).reduce((a, s) => a + s.mol, 0) + premixExtent * t.coef;
      if (!(mol > 0) && partners === 'assumed') {
        external.add(t.key);
        continue;
      }
      if (!(mol > 0)) missing.push(t.key);
      maxExtent = Math.min(maxExtent, mol / t.coef);
    }
    if (!Number.isFinite(maxExtent) || missing.length) maxExtent = 0;
    if (missing.length) {
      warnings.push({
        warning: {
          code: 'thermal.reaction-partner-missing',
          message: `${label}: the reaction needs ${missing.join(', ')}, which no component of the pack brings; it does not run (add the partner as an ingredient)`,
        },
        subject: label,
      });
    }

    // Take the reactants: premix first, then the reaction's own components, then dissolving partners.
    for (const t of reactants) {
      let need = Math.max(0, maxExtent - premixExtent) * t.coef;
      for (const s of supply.get(t.key) ?? []) {
        const take = Math.min(need, s.mol);
        need -= take;
        massLeftG[s.i] = Math.max(0, massLeftG[s.i]! - take * M(t.key));
      }
    }
    // Premix beyond the extent stays in ratio.
    for (const i of members) {
      const c = components[i]!;
      const q = c.process as ReactionProcess;
      if (q.basis === 'premix') {
        const share = premixExtent > 0 ? Math.min(1, maxExtent / premixExtent) : 0;
        massLeftG[i] = c.massG * (1 - share);
      }
    }
    for (const i of members) {
      const c = components[i]!;
      const q = c.process as ReactionProcess;
      const left = massLeftG[i]!;
      if (left > 1e-9) {
        // A premix left over is taken at the Cp of its named reactant (assumption).
        const key = q.ingredientKey;
        const cpMolar = port.heatCapacity_J_per_mol_K(key);
        leftovers.push({ label: `${c.label} (unreacted)`, massG: left, cpJPerGK: cpMolar === null ? FALLBACK_SOLID_CP_J_PER_GK : cpMolar / M(key) });
      }
      massLeftG[i] = 0;
    }

    // Products: phases by the data and the conditions.
    let waterPerExtent = p.reactants.filter((t) => isWater(t.key)).reduce((a, t) => a + t.coef, 0) - p.products.filter((t) => isWater(t.key)).reduce((a, t) => a + t.coef, 0);
    const liquidAtEndG = Math.max(0, waterChargedG - waterPerExtent * maxExtent * WATER_MOLAR_MASS_G_PER_MOL);
    const products: { key: string; coef: number }[] = [];
    for (const t of p.products) {
      if (isWater(t.key)) continue;
      const phase = phaseOf(t.key);
      if (p.dH_kJ_per_mol !== undefined) {
        products.push(t);
        continue;
      }
      const gasKey = `${formulaOf(t.key)}(g)`;
      const aqKey = `${formulaOf(t.key)}(aq)`;
      if (phase === 'g' && port.formationEnthalpy_kJ_per_mol(aqKey) !== null) {
        const gG = port.formationGibbs_kJ_per_mol?.(t.key) ?? null;
        const gAq = port.formationGibbs_kJ_per_mol?.(aqKey) ?? null;
        if (gG !== null && gAq !== null && liquidAtEndG > 0 && maxExtent > 0) {
          const kH = Math.exp((-(gAq - gG) * 1000) / (R_J_PER_MOL_K * (REFERENCE_TEMP_C + 273.15))); // mol/(kg·bar)
          const dissolvedMol = Math.min(t.coef * maxExtent, kH * (liquidAtEndG / 1000));
          const f = dissolvedMol / (t.coef * maxExtent);
          if (f > 1e-6) products.push({ key: aqKey, coef: t.coef * f });
          if (f < 1 - 1e-6) products.push({ key: t.key, coef: t.coef * (1 - f) });
          continue;
        }
      }
      if ((phase === 'aq' || phase === 'ao') && liquidAtEndG <= 0 && port.formationEnthalpy_kJ_per_mol(gasKey) !== null) {
        products.push({ key: gasKey, coef: t.coef });
        continue;
      }
      products.push(t);
    }

    let counted = 0;
    let countedCp = 0;
    let externalMass = 0;
    for (const t of reactants) {
      if (external.has(t.key)) {
        externalMass += t.coef * M(t.key);
        continue;
      }
      counted += t.coef * M(t.key);
      countedCp += cpOf(t.key, t.coef);
    }
    if (external.size) {
      warnings.push({
        warning: { code: 'thermal.reaction-partners-external', message: `${label}: ${[...external].join(', ')} assumed present in excess in other components; their consumption is counted as drawn from outside` },
        subject: label,
      });
    }
    let productMass = 0;
    let productCp = 0;
    let gasMass = 0;
    let gasMol = 0;
    for (const t of products) {
      const m = t.coef * M(t.key);
      if (phaseOf(t.key) === 'g') {
        gasMass += m;
        gasMol += t.coef;
      } else {
        productMass += m;
        productCp += cpOf(t.key, t.coef);
      }
    }

    let dH = p.dH_kJ_per_mol;
    if (dH === undefined) {
      let sum = 0;
      const lacking: string[] = [];
      const terms: [readonly { key: string; coef: number }[], number][] = [
        [products, 1],
        [p.products.filter((t) => isWater(t.key)), 1],
        [p.reactants, -1],
      ];
      for (const [ts, sign] of terms) {
        for (const t of ts) {
          const h = port.formationEnthalpy_kJ_per_mol(t.key);
          if (h === null) lacking.push(t.key);
          else sum += sign * t.coef * h;
        }
      }
      if (lacking.length) {
        throw new ThermalModelError(`expected ΔfH° of every species of the reaction (or dH_kJ_per_mol), found none for ${lacking.join(', ')}`, { field: `${first.field}.process` });
      }
      dH = sum;
    }
    waterPerExtent = Number.isFinite(waterPerExtent) ? waterPerExtent : 0;
    reactions.push({
      label,
      maxExtentMol: maxExtent,
      waterPerExtent,
      dH_kJ_per_mol: dH,
      countedReactantMassPerExtentG: counted,
      countedReactantCpPerExtent: countedCp,
      productMassPerExtentG: productMass,
      productCpPerExtent: productCp,
      gasMassPerExtentG: gasMass,
      gasMolPerExtent: gasMol,
      externalReactantMassPerExtentG: externalMass,
      kPerS: p.rateConstantPerMin / 60,
    });
  }
  return { reactions, massLeftG, leftovers, warnings };
}
