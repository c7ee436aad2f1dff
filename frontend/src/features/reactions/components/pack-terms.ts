import type { PackTerm } from '@shared/chemistry/pack-reaction';
import type { ReactionResponse } from '@shared/schemas/thermo';

export type Term = { formula: string; phase: string; coef: string; massG: string };
export type ReactionValues = { reactants: Term[]; products: Term[]; tempC: string; waterRatio: string };

/** A number typed in a field (decimal comma and minus sign accepted); undefined when blank, NaN when not a number. */
export function num(text: string | undefined): number | undefined {
  const t = (text ?? '').trim().replace(',', '.').replace('−', '-');
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/** The API's reaction terms as the shared pack computation takes them. */
export function packTerms(result: ReactionResponse): PackTerm[] {
  return result.terms.map((t) => ({
    key: t.key,
    formula: t.formula,
    phase: t.phase,
    nu: t.nu,
    molarMass_g_per_mol: t.molarMass_g_per_mol,
    Cp_J_per_mol_K: t.Cp_J_per_mol_K,
  }));
}

/** Indices of the reagent rows the request sends (rows with a formula or moles), in order. */
export function reagentRows(values: ReactionValues): number[] {
  return values.reactants.flatMap((t, k) => (t.formula.trim() !== '' || t.coef.trim() !== '' ? [k] : []));
}

/** Grams by species key from the reagent rows; null when the answer is for another reaction (rows and terms differ). */
export function chargeByKey(values: ReactionValues, result: ReactionResponse, parse: (text: string) => number | undefined): Record<string, number> | null {
  const rows = reagentRows(values);
  const reagents = result.terms.filter((t) => t.nu < 0);
  if (rows.length !== reagents.length) return null;
  const out: Record<string, number> = {};
  rows.forEach((row, k) => {
    const g = parse(values.reactants[row]!.massG);
    const key = reagents[k]!.key;
    if (g !== undefined && Number.isFinite(g)) out[key] = (out[key] ?? 0) + g;
  });
  return out;
}
