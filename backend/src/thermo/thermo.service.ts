import {
  FormulaError,
  MissingThermoDataError,
  ReactionBalanceError,
  UnknownSpeciesError,
  evaluateReaction,
  findSpecies,
} from '@shared/chemistry';
import type { ChemistryLibrary } from '@shared/chemistry/types';
import type { FieldError, ReactionRequest, ReactionResponse } from '@shared/schemas';
import { AppError } from '../http/errors';
import { workspaceChemistryLibrary } from '../species/species.service';

export async function chemistryLibraryFor(workspaceId: number): Promise<ChemistryLibrary> {
  return workspaceChemistryLibrary(workspaceId);
}

/**
 * ΔrH, ΔrS, ΔrG at tempC and the crossover temperature of a balanced reaction, from the
 * workspace's species data (shared evaluateReaction). Each term is looked up first so an unknown
 * formula is reported at its own field (`reactants.1.formula`); an unbalanced reaction names the
 * elements or charge that do not balance.
 */
export async function reactionThermo(workspaceId: number, input: ReactionRequest): Promise<ReactionResponse> {
  const lib = await workspaceChemistryLibrary(workspaceId);
  const fields: FieldError[] = [];
  for (const side of ['reactants', 'products'] as const) {
    input[side].forEach((term, k) => {
      try {
        const species = findSpecies(lib, term.formula, term.phase ?? null);
        if (species.dfH_kJ_per_mol === null) fields.push({ field: `${side}.${k}.formula`, message: `${species.key} has no ΔfH° in the species data` });
      } catch (error) {
        if (error instanceof UnknownSpeciesError || error instanceof FormulaError) fields.push({ field: `${side}.${k}.formula`, message: error.message });
        else throw error;
      }
    });
  }
  if (fields.length) throw AppError.validation(`Invalid reaction: ${fields.map((f) => `${f.field}: ${f.message}`).join('; ')}`, fields);
  try {
    const r = evaluateReaction(lib, { reactants: input.reactants, products: input.products, tempC: input.tempC });
    return {
      dH_kJ: r.dH_kJ,
      dS_J_per_K: r.dS_J_per_K,
      dG_kJ: r.dG_kJ,
      crossoverC: r.crossoverC,
      favourability: r.favourability,
      favourabilityText: r.favourabilityText,
      dH298_kJ: r.dH298_kJ,
      dS298_J_per_K: r.dS298_J_per_K,
      dG298_kJ: r.dG298_kJ,
      dCp_J_per_K: r.dCp_J_per_K,
      crossoverKirchhoffC: r.crossoverKirchhoffC,
      tempC: r.tempC,
      warnings: r.warnings,
      terms: r.terms.map((t) => ({
        key: t.species.key,
        name: t.species.name,
        formula: t.species.formula,
        phase: t.species.phase,
        nu: t.nu,
        molarMass_g_per_mol: t.species.molarMass_g_per_mol,
        Cp_J_per_mol_K: t.species.Cp_J_per_mol_K,
        source: t.species.source,
      })),
    };
  } catch (error) {
    if (error instanceof ReactionBalanceError) {
      throw AppError.validation(error.message, [{ field: 'products', message: `do not balance the reactants: ${error.message.replace(/^Reaction is not balanced: /, '')}` }]);
    }
    if (error instanceof MissingThermoDataError || error instanceof RangeError) {
      throw AppError.validation(error.message, [{ field: error instanceof RangeError ? 'tempC' : 'reactants', message: error.message }]);
    }
    throw error;
  }
}
