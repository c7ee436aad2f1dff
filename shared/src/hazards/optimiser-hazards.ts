import type { ConcentrationCap } from '../schemas/briefs';
import type { IngredientHazardData } from '../schemas/hazards';
import { AN_MAX_MASS_FRACTION, AN_PRECURSOR_SOURCE } from './hazard-notes';

/**
 * How a brief's `excludedHazardClasses` reaches the optimiser.
 *
 * 1. Ingredient filter: an entry that is one of an ingredient's hazard tags leaves the ingredient
 *    out. Tags ({@link hazardTags}): each class code (`ox-sol`), class with category
 *    (`ox-sol-3`, `skin-corr-1b`), incompatibility group (`oxidiser`) and regulatory flag code
 *    (`eu-2019-1148-an`), plus any `hazardClasses` given by hand.
 * 2. Concentration caps: an entry naming a cap token keeps the ingredients that would cause a
 *    class (or a precursor status) just below the cut-off, as per-ingredient caps on their mass
 *    fraction of the fill ({@link hazardCapsFor}):
 *    - `precursor-an` (also `cap:precursor-an`): each ingredient flagged `eu-2019-1148-an` below
 *      16 % N from AN, w_AN < 0.16 / 0.350 ≈ 0.457 (Regulation (EU) 2019/1148 Annex I);
 *    - `cap:skin-corr-1`: skin corr 1 ingredients < 5 % (GHS Table 3.2.3);
 *    - `cap:eye-dam-1`: skin corr 1 and eye dam 1 ingredients < 3 % (GHS Table 3.3.3);
 *    - `cap:skin-irrit-2`: skin corr 1 < 1 %, skin irrit 2 < 10 % (GHS Table 3.2.3);
 *    - `cap:eye-irrit-2`: skin corr 1 / eye dam 1 < 1 %, eye irrit 2 < 10 % (GHS Table 3.3.3);
 *    - `cap:stot-se-3`: STOT SE 3 ingredients < 20 % (CLP 3.8.3.4.5).
 *    Caps are per ingredient: two ingredients of the same class may still add up past the
 *    cut-off; the candidate's own classification shows it (and the optimiser warns).
 *    Each cap sits {@link CAP_MARGIN} below the cut-off, since the cut-offs are "≥".
 */

/** Margin below a cut-off, as a mass fraction (0.01 percentage points). */
export const CAP_MARGIN = 1e-4;

/** What the hazards hookup reads of an optimiser ingredient. */
export interface HazardTaggedIngredient {
  id: string;
  hazardData?: IngredientHazardData | null;
  hazardClasses?: readonly string[];
}

/**
 * The tags a brief's excluded hazard classes match: class codes, class-category codes
 * (lower case), incompatibility groups, regulatory flag codes, and `hazardClasses` given by hand.
 *
 * @example hazardTags({ id: 'an', hazardData: anData }) // → ['ox-sol', 'ox-sol-3', 'eye-irrit', 'eye-irrit-2', 'oxidiser', 'eu-2019-1148-an', 'un-1942']
 */
export function hazardTags(i: HazardTaggedIngredient): string[] {
  const tags = new Set<string>(i.hazardClasses ?? []);
  const d = i.hazardData;
  if (d) {
    for (const c of d.classifications) {
      tags.add(c.hazardClass);
      tags.add(`${c.hazardClass}-${c.category.toLowerCase()}`);
    }
    for (const g of d.incompatibilityGroups) tags.add(g);
    for (const f of d.regulatoryFlags) tags.add(f.code);
  }
  return [...tags];
}

interface CapRule {
  token: string;
  /** Highest mass fraction for an ingredient, or null when the rule does not touch it. */
  limit: (d: IngredientHazardData) => number | null;
  reason: string;
}

const hasClass = (d: IngredientHazardData, cls: string, cats?: readonly string[]) => d.classifications.some((c) => c.hazardClass === cls && (!cats || cats.includes(c.category)));
const isCorr = (d: IngredientHazardData) => hasClass(d, 'skin-corr');

/** The cap tokens and their limits (see the module comment). */
export const HAZARD_CAP_RULES: readonly CapRule[] = [
  { token: 'precursor-an', limit: (d) => (d.regulatoryFlags.some((f) => f.code === 'eu-2019-1148-an') ? AN_MAX_MASS_FRACTION : null), reason: `precursor.an-nitrogen: below 16 % N from AN (${AN_PRECURSOR_SOURCE})` },
  { token: 'cap:skin-corr-1', limit: (d) => (isCorr(d) ? 0.05 : null), reason: 'below the Skin Corr. 1 cut-off of 5 % (GHS Rev. 9 Table 3.2.3)' },
  { token: 'cap:eye-dam-1', limit: (d) => (isCorr(d) || hasClass(d, 'eye-dam', ['1']) ? 0.03 : null), reason: 'below the Eye Dam. 1 cut-off of 3 % (GHS Rev. 9 Table 3.3.3)' },
  { token: 'cap:skin-irrit-2', limit: (d) => (isCorr(d) ? 0.01 : hasClass(d, 'skin-irrit', ['2']) ? 0.1 : null), reason: 'below the Skin Irrit. 2 cut-offs of 1 % (corr 1) and 10 % (irrit 2) (GHS Rev. 9 Table 3.2.3)' },
  {
    token: 'cap:eye-irrit-2',
    limit: (d) => (isCorr(d) || hasClass(d, 'eye-dam', ['1']) ? 0.01 : hasClass(d, 'eye-irrit') ? 0.1 : null),
    reason: 'below the Eye Irrit. 2 cut-offs of 1 % (corr 1 / eye dam 1) and 10 % (eye irrit 2) (GHS Rev. 9 Table 3.3.3)',
  },
  { token: 'cap:stot-se-3', limit: (d) => (hasClass(d, 'stot-se', ['3']) ? 0.2 : null), reason: 'below the STOT SE 3 cut-off of 20 % (CLP 3.8.3.4.5)' },
];

const TOKEN_ALIASES: Readonly<Record<string, string>> = { 'cap:precursor-an': 'precursor-an' };

/** True when an excluded-hazard-class entry is a cap token rather than an ingredient tag. */
export function isHazardCapToken(entry: string): boolean {
  const t = TOKEN_ALIASES[entry] ?? entry;
  return HAZARD_CAP_RULES.some((r) => r.token === t);
}

/**
 * Concentration caps for the cap tokens among a brief's excluded hazard classes: per ingredient,
 * the tightest limit of the tokens that touch it, minus {@link CAP_MARGIN}.
 *
 * @example hazardCapsFor(['precursor-an'], [{ id: 'an', hazardData: anData }])
 * // → [{ ingredientId: 'an', maxMassFraction: 0.4570…, reason: 'precursor.an-nitrogen: …' }]
 */
export function hazardCapsFor(excludedHazardClasses: readonly string[], ingredients: readonly HazardTaggedIngredient[]): ConcentrationCap[] {
  const tokens = new Set(excludedHazardClasses.map((e) => TOKEN_ALIASES[e] ?? e));
  const rules = HAZARD_CAP_RULES.filter((r) => tokens.has(r.token));
  const caps: ConcentrationCap[] = [];
  for (const i of ingredients) {
    if (!i.hazardData) continue;
    let best: { f: number; reason: string } | null = null;
    for (const r of rules) {
      const f = r.limit(i.hazardData);
      if (f !== null && (!best || f < best.f)) best = { f, reason: r.reason };
    }
    if (best) caps.push({ ingredientId: i.id, maxMassFraction: Math.max(0, best.f - CAP_MARGIN), reason: best.reason.slice(0, 300) });
  }
  return caps;
}
