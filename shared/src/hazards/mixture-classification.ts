import type { GhsClassification, HazardNote, IngredientHazardData, LabelElements } from '../schemas/hazards';
import { hazardClassLabel } from './hazard-class-names';
import { orderStatementCodes, pStatementsFor, P_KEEP_OUT_OF_REACH_OF_CHILDREN } from './h-statements';

/**
 * GHS classification of a mixture from its ingredients, by the published rules that work by
 * arithmetic: additivity of acute toxicity (ATEmix), the additivity cut-offs for skin and eye
 * effects, the pH rule, and simple generic cut-offs. Concentrations are mass % of the fill
 * (every ingredient in the pack, water included, packaging excluded).
 *
 * Sources (section numbers written from memory; the rules checked against the worked examples
 * in tests/reference/hazards-mixture-classification.test.ts):
 * - UN GHS Rev. 9 (2021), ch. 3.1 (acute toxicity), ch. 3.2 (skin), ch. 3.3 (eye), ch. 3.8 (STOT SE);
 * - Regulation (EC) No 1272/2008 (CLP), Annex I parts 3.1–3.8, Art. 20 (signal word), Art. 26
 *   (pictogram precedence), Art. 27 (H-statement duplication).
 * Not modelled: specific concentration limits (SCLs) and M-factors of individual substances,
 * bridging principles, test data on the mixture itself, aquatic summation. A class that needs
 * a test on the mixture (oxidising, water-reactive, flammable solids) is carried over from the
 * ingredient, marked so, never computed.
 */

export const MIXTURE_RULES_SOURCE = 'UN GHS Rev. 9 ch. 3.1–3.3, 3.8; CLP (EC) 1272/2008 Annex I 3.1–3.8, Art. 20, 26, 27 (section numbers from memory)';

/** One ingredient of the mixture as classification reads it. */
export interface MixtureComponent {
  name: string;
  massG: number;
  /** Null: nothing known and nothing classified (water, inert fillers). */
  hazardData: IngredientHazardData | null;
  /**
   * True when the ingredient has no usable acute-toxicity information at all (GHS 3.1.3.6.2.2):
   * it counts towards the "unknown" share of the ATEmix formula.
   */
  acuteToxicityUnknown?: boolean;
}

export interface MixtureClassificationOptions {
  /** Measured pH of the mixture as used (e.g. the activated solution); enables the pH rule. */
  mixturePH?: number | null;
  /** Buffering data (acid/alkaline reserve) show the extreme pH does not make it corrosive: the pH rule is not applied. */
  bufferingShowsNotCorrosive?: boolean;
  /** Use acute-toxicity category 5 (UN GHS; not adopted in the EU CLP). Default false. */
  includeCategory5?: boolean;
  /**
   * Names of ingredients below 1 % to count as relevant all the same ("< 1 % where there is reason
   * to suspect relevance", GHS 3.2.3.3.1 / 3.3.3.3.1; CLP 3.2.3.3.1).
   */
  alsoRelevant?: readonly string[];
  /** Sold to the general public: add P102 to a classified mixture's label. Default true. */
  consumerProduct?: boolean;
}

export interface ClassifiedEntry extends GhsClassification {
  /** The rule applied and the figure it compared, with its section. */
  rule: string;
}

export type AteRoute = 'oral' | 'dermal' | 'inhalation-gas' | 'inhalation-vapour' | 'inhalation-dust-mist';

export interface AteItem {
  /** Mass % of the mixture. */
  concentrationPct: number;
  /** Acute toxicity estimate of the ingredient by this route (mg/kg, mg/L or ppmV); null when unknown or not toxic by this route. */
  ate: number | null;
  /** No usable information by this route (counts to the unknown share). */
  unknown?: boolean;
}

export interface AteMixResult {
  /** ATEmix in the route's unit; Infinity when no ingredient contributes. */
  ateMix: number;
  /** Σ of the unknown ingredients' concentrations, %. */
  unknownPct: number;
  /** True when the corrected formula of GHS 3.1.3.6.2.3 was used (unknown share > 10 %). */
  corrected: boolean;
  category: number | null;
}

/**
 * Converted acute toxicity point estimates by category (UN GHS Rev. 9 Table 3.1.2; CLP Annex I
 * Table 3.1.2; from memory): used when an ingredient is classified but its LD50/LC50 is not given.
 */
export const CONVERTED_ATE: Readonly<Record<AteRoute, readonly number[]>> = {
  oral: [0.5, 5, 100, 500, 2500],
  dermal: [5, 50, 300, 1100, 2500],
  'inhalation-gas': [10, 100, 700, 4500],
  'inhalation-vapour': [0.05, 0.5, 3, 11],
  'inhalation-dust-mist': [0.005, 0.05, 0.5, 1.5],
};

/**
 * Upper bounds of the acute toxicity categories by route (UN GHS Rev. 9 Table 3.1.1; CLP Annex I
 * Table 3.1.1; from memory): category n when ATE ≤ bounds[n − 1] (and above the previous bound).
 * Oral and dermal mg/kg bw, vapours and dusts/mists mg/L (4 h), gases ppmV (4 h). The fifth
 * bound (category 5, 5000 mg/kg) is GHS only.
 */
export const ATE_CATEGORY_BOUNDS: Readonly<Record<AteRoute, readonly number[]>> = {
  oral: [5, 50, 300, 2000, 5000],
  dermal: [50, 200, 1000, 2000, 5000],
  'inhalation-gas': [100, 500, 2500, 20000],
  'inhalation-vapour': [0.5, 2, 10, 20],
  'inhalation-dust-mist': [0.05, 0.5, 1, 5],
};

/**
 * The acute toxicity category of an ATE, or null when not classified.
 * Formula: the first n with ATE ≤ bound[n − 1] (UN GHS Table 3.1.1).
 *
 * @example ateCategory('oral', 873) // → 4
 * @example ateCategory('oral', 3000) // → null (5 with includeCategory5)
 */
export function ateCategory(route: AteRoute, ate: number, includeCategory5 = false): number | null {
  const bounds = ATE_CATEGORY_BOUNDS[route];
  for (let i = 0; i < bounds.length; i++) {
    if (i === 4 && !includeCategory5) break;
    if (ate <= bounds[i]!) return i + 1;
  }
  return null;
}

/**
 * ATEmix by the additivity formula (UN GHS Rev. 9, 3.1.3.6.1; CLP Annex I 3.1.3.6.1):
 *   100 / ATEmix = Σ Cᵢ / ATEᵢ
 * over the relevant ingredients (Cᵢ ≥ 1 %, GHS 3.1.3.3(a)) that have an ATE. When the
 * ingredients of unknown acute toxicity add up to more than 10 % (GHS 3.1.3.6.2.3):
 *   (100 − Σ C_unknown) / ATEmix = Σ Cᵢ / ATEᵢ.
 *
 * @example ateMix('oral', [{ concentrationPct: 16, ate: 1600 }, { concentrationPct: 4, ate: 200 }, { concentrationPct: 80, ate: 3450 }], true).ateMix
 * // → 1880 (mg/kg; UN ST/SG/AC.10/C.4/2008/23 Annex 2, example on 3.1.3.6.1)
 */
export function ateMix(route: AteRoute, items: readonly AteItem[], includeCategory5 = false): AteMixResult {
  let sum = 0;
  let unknownPct = 0;
  for (const it of items) {
    if (!(it.concentrationPct >= 0)) throw new Error(`expected a concentration ≥ 0 %; found ${it.concentrationPct}`);
    if (it.concentrationPct < 1) continue;
    if (it.unknown) {
      unknownPct += it.concentrationPct;
      continue;
    }
    if (it.ate === null) continue;
    if (!(it.ate > 0)) throw new Error(`expected an acute toxicity estimate > 0; found ${it.ate}`);
    sum += it.concentrationPct / it.ate;
  }
  const corrected = unknownPct > 10;
  const numerator = corrected ? 100 - unknownPct : 100;
  const value = sum > 0 ? numerator / sum : Number.POSITIVE_INFINITY;
  return { ateMix: value, unknownPct, corrected, category: Number.isFinite(value) ? ateCategory(route, value, includeCategory5) : null };
}

// --- helpers over the components --------------------------------------------------------------

interface Share {
  name: string;
  pct: number;
  data: IngredientHazardData | null;
  unknown: boolean;
}

function shares(components: readonly MixtureComponent[]): Share[] {
  const total = components.reduce((a, c) => a + c.massG, 0);
  if (!(total > 0)) throw new Error(`expected a mixture with a positive total mass; found ${total} g`);
  return components.map((c) => {
    if (!(c.massG >= 0)) throw new Error(`expected massG ≥ 0 for ${c.name}; found ${c.massG}`);
    return { name: c.name, pct: (100 * c.massG) / total, data: c.hazardData, unknown: c.acuteToxicityUnknown === true };
  });
}

function has(d: IngredientHazardData | null, hazardClass: string, categories?: readonly string[]): GhsClassification | undefined {
  return d?.classifications.find((c) => c.hazardClass === hazardClass && (!categories || categories.includes(c.category)));
}

const fmt = (pct: number) => `${Number(pct.toPrecision(3))} %`;

/** Relevant-ingredient threshold for additivity, % (GHS 3.1.3.3(a), 3.2.3.3.1, 3.3.3.3.1). */
export const RELEVANT_INGREDIENT_PCT = 1;

// --- acute toxicity ---------------------------------------------------------------------------

const ACUTE_ROUTES = [
  { hazardClass: 'acute-tox-oral', route: 'oral' as const, h: ['H300', 'H300', 'H301', 'H302', 'H303'] },
  { hazardClass: 'acute-tox-dermal', route: 'dermal' as const, h: ['H310', 'H310', 'H311', 'H312', 'H313'] },
  // Inhalation of the solids here is as dusts; an explicit LC50 is not kept in the hazard data.
  { hazardClass: 'acute-tox-inhal', route: 'inhalation-dust-mist' as const, h: ['H330', 'H330', 'H331', 'H332', 'H333'] },
];

function ingredientAte(s: Share, hazardClass: string, route: AteRoute, includeCategory5: boolean): number | null {
  const d = s.data;
  const given = route === 'oral' ? d?.acuteToxicityEstimates.oralMgPerKg : route === 'dermal' ? d?.acuteToxicityEstimates.dermalMgPerKg : null;
  const cls = has(d, hazardClass);
  const limit = ATE_CATEGORY_BOUNDS[route][includeCategory5 ? 4 : 3] ?? Number.POSITIVE_INFINITY;
  // Ingredients whose ATE falls in no category are left out (GHS 3.1.3.6.1(a)).
  if (given != null) return given <= limit ? given : null;
  if (cls) {
    const n = Number.parseInt(cls.category, 10);
    const v = CONVERTED_ATE[route][n - 1];
    return v !== undefined && (n <= 4 || includeCategory5) ? v : null;
  }
  return null;
}

// --- the classification -----------------------------------------------------------------------

export interface MixtureClassification {
  classifications: ClassifiedEntry[];
  /** ATEmix per route where any ingredient contributes. */
  ate: Partial<Record<AteRoute, AteMixResult>>;
  label: LabelElements;
  /** Carried-over classes, unknown-toxicity statements, classes this module does not compute. */
  notes: HazardNote[];
  /** Supplemental label text, e.g. the GHS 3.1.3.6.2.2 unknown-toxicity statement. */
  supplementalStatements: string[];
}

const SKIN_CORR_SUB = ['1A', '1B', '1C'] as const;

/**
 * Classify a mixture by the arithmetic rules, with the rule and figure behind each class.
 *
 * Rules (mass % of the fill; ingredients below 1 % ignored as not relevant):
 * - acute toxicity: ATEmix per route ({@link ateMix}) → category by {@link ateCategory}
 *   (GHS 3.1.3.6, CLP 3.1.3.6);
 * - skin (GHS Rev. 9 3.2.3.3.4 / Table 3.2.3; CLP 3.2.3.3.4, Table 3.2.3): Σ skin corr 1 ≥ 5 %
 *   → Skin Corr. 1 (CLP sub-category: Σ1A ≥ 5 % → 1A, Σ(1A+1B) ≥ 5 % → 1B, else 1C); else
 *   Σ skin corr 1 ≥ 1 %, or 10 × Σ skin corr 1 + Σ skin irrit 2 ≥ 10 % → Skin Irrit. 2;
 * - eye (GHS 3.3.3.3.4 / Table 3.3.3; CLP Table 3.3.3): Σ(skin corr 1 + eye dam 1) ≥ 3 % → Eye
 *   Dam. 1; else Σ(skin corr 1 + eye dam 1) ≥ 1 %, or 10 × Σ(skin corr 1 + eye dam 1) + Σ eye
 *   irrit 2 ≥ 10 % → Eye Irrit. 2; a Skin Corr. 1 mixture is also Eye Dam. 1 (H318 not printed,
 *   CLP Art. 27);
 * - pH rule (GHS 3.2.3.1.2 and 3.3.3.1.2 / CLP 3.2.3.1.2, 3.3.3.1.2; numbering from memory):
 *   a mixture pH ≤ 2 or ≥ 11.5, without buffering data to the contrary → Skin Corr. 1 and Eye Dam. 1;
 * - STOT SE 3 (CLP 3.8.3.4.5): Σ of the ingredients with the same STOT SE 3 effect ≥ 20 %;
 * - generic cut-offs for CMR, sensitisers and STOT 1/2 (CLP Tables 3.4.5, 3.5.3, 3.6.3, 3.7.2,
 *   3.8.3, 3.9.4; from memory);
 * - oxidising / water-reactive / flammable / pyrophoric / self-heating solids and corrosive to
 *   metals: not by arithmetic (they need the UN test on the mixture, GHS ch. 2.7–2.14, 2.16):
 *   carried over from an ingredient present at ≥ 1 %, with a note.
 *
 * @example classifyMixture([{ name: 'CaCl2', massG: 40, hazardData: eyeIrrit2 }, { name: 'water', massG: 60, hazardData: null }])
 * // → classifications [{ hazardClass: 'eye-irrit', category: '2', rule: 'Σ eye irrit 2 = 40 % ≥ 10 % …' }]
 */
export function classifyMixture(components: readonly MixtureComponent[], options: MixtureClassificationOptions = {}): MixtureClassification {
  const s = shares(components);
  const alsoRelevant = new Set(options.alsoRelevant ?? []);
  const relevant = s.filter((x) => x.pct >= RELEVANT_INGREDIENT_PCT || (x.pct > 0 && alsoRelevant.has(x.name)));
  const includeCategory5 = options.includeCategory5 ?? false;
  const out: ClassifiedEntry[] = [];
  const notes: HazardNote[] = [];
  const supplemental: string[] = [];
  const ate: Partial<Record<AteRoute, AteMixResult>> = {};

  // Acute toxicity by additivity.
  for (const r of ACUTE_ROUTES) {
    const items: AteItem[] = s.map((x) => ({ concentrationPct: x.pct, ate: ingredientAte(x, r.hazardClass, r.route, includeCategory5), unknown: x.unknown }));
    if (!items.some((i) => i.ate !== null && i.concentrationPct >= 1)) continue;
    const res = ateMix(r.route, items, includeCategory5);
    ate[r.route] = res;
    if (res.unknownPct >= 1) supplemental.push(`${fmt(res.unknownPct)} of the mixture consists of ingredient(s) of unknown acute toxicity (${r.route})`);
    if (res.category !== null) {
      const unit = r.route === 'oral' || r.route === 'dermal' ? 'mg/kg' : 'mg/L';
      out.push({
        hazardClass: r.hazardClass,
        category: String(res.category),
        hStatements: [r.h[res.category - 1]!],
        rule: `ATEmix (${r.route}) = ${Number(res.ateMix.toPrecision(4))} ${unit} ${res.corrected ? `by the corrected formula (unknown ${fmt(res.unknownPct)} > 10 %, GHS 3.1.3.6.2.3)` : 'by additivity (GHS 3.1.3.6.1)'} → category ${res.category} (GHS Table 3.1.1)`,
      });
    }
  }

  // Skin corrosion / irritation.
  const sum = (pred: (x: Share) => boolean) => relevant.filter(pred).reduce((a, x) => a + x.pct, 0);
  const corrOf = (x: Share, cats?: readonly string[]) => has(x.data, 'skin-corr', cats) !== undefined;
  const sCorr = sum((x) => corrOf(x));
  const sCorr1A = sum((x) => corrOf(x, ['1A']));
  const sCorr1AB = sum((x) => corrOf(x, ['1A', '1B']));
  const sIrrit = sum((x) => has(x.data, 'skin-irrit', ['2']) !== undefined && !corrOf(x));
  const pH = options.mixturePH ?? null;
  const pHExtreme = pH !== null && (pH <= 2 || pH >= 11.5) && !options.bufferingShowsNotCorrosive;
  let skinCorr1 = false;
  if (pHExtreme) {
    skinCorr1 = true;
    out.push({ hazardClass: 'skin-corr', category: '1', hStatements: ['H314'], rule: `mixture pH ${pH} ${pH! <= 2 ? '≤ 2' : '≥ 11.5'} with no buffering data → Skin Corr. 1 (GHS 3.2.3.1.2 / CLP 3.2.3.1.2, pH rule)` });
  } else if (sCorr >= 5) {
    skinCorr1 = true;
    const sCorrSub = sum((x) => corrOf(x, SKIN_CORR_SUB));
    // CLP Table 3.2.3: the sub-category from the sums; an ingredient without one ("1") gives "1".
    const sub = sCorr1A >= 5 ? '1A' : sCorr1AB >= 5 ? '1B' : sCorrSub >= 5 ? '1C' : '1';
    out.push({ hazardClass: 'skin-corr', category: sub, hStatements: ['H314'], rule: `Σ skin corr 1 = ${fmt(sCorr)} ≥ 5 % → Skin Corr. ${sub} (GHS Table 3.2.3; CLP Table 3.2.3 for the sub-category)` });
  } else if (sCorr >= 1) {
    out.push({ hazardClass: 'skin-irrit', category: '2', hStatements: ['H315'], rule: `1 % ≤ Σ skin corr 1 = ${fmt(sCorr)} < 5 % → Skin Irrit. 2 (GHS Table 3.2.3)` });
  } else if (10 * sCorr + sIrrit >= 10) {
    out.push({
      hazardClass: 'skin-irrit',
      category: '2',
      hStatements: ['H315'],
      rule: `10 × Σ skin corr 1 + Σ skin irrit 2 = ${fmt(10 * sCorr + sIrrit)} ≥ 10 % → Skin Irrit. 2 (GHS Table 3.2.3)`,
    });
  }
  // Serious eye damage / eye irritation.
  const eyeDamOf = (x: Share) => corrOf(x) || has(x.data, 'eye-dam', ['1']) !== undefined;
  const sEyeDam = sum(eyeDamOf);
  const sEyeIrrit = sum((x) => !eyeDamOf(x) && has(x.data, 'eye-irrit', ['2', '2A', '2B']) !== undefined);
  if (pHExtreme) {
    out.push({ hazardClass: 'eye-dam', category: '1', hStatements: ['H318'], rule: `mixture pH ${pH} ${pH! <= 2 ? '≤ 2' : '≥ 11.5'} with no buffering data → Eye Dam. 1 (GHS 3.3.3.1.2 / CLP 3.3.3.1.2, pH rule)` });
  } else if (skinCorr1) {
    out.push({ hazardClass: 'eye-dam', category: '1', hStatements: ['H318'], rule: 'a Skin Corr. 1 mixture is also Eye Dam. 1 (GHS 3.3.2 / CLP 3.3.2.1; H318 covered by H314 on the label)' });
  } else if (sEyeDam >= 3) {
    out.push({ hazardClass: 'eye-dam', category: '1', hStatements: ['H318'], rule: `Σ(skin corr 1 + eye dam 1) = ${fmt(sEyeDam)} ≥ 3 % → Eye Dam. 1 (GHS Table 3.3.3)` });
  } else if (sEyeDam >= 1) {
    out.push({ hazardClass: 'eye-irrit', category: '2', hStatements: ['H319'], rule: `1 % ≤ Σ(skin corr 1 + eye dam 1) = ${fmt(sEyeDam)} < 3 % → Eye Irrit. 2 (GHS Table 3.3.3)` });
  } else if (10 * sEyeDam + sEyeIrrit >= 10) {
    out.push({
      hazardClass: 'eye-irrit',
      category: '2',
      hStatements: ['H319'],
      rule: `10 × Σ(skin corr 1 + eye dam 1) + Σ eye irrit 2 = ${fmt(10 * sEyeDam + sEyeIrrit)} ≥ 10 % → Eye Irrit. 2 (GHS Table 3.3.3)`,
    });
  }

  // STOT SE 3 by effect (H335 respiratory irritation, H336 narcotic effects).
  for (const h of ['H335', 'H336']) {
    const total = sum((x) => x.data?.classifications.some((c) => c.hazardClass === 'stot-se' && c.category === '3' && c.hStatements.includes(h)) ?? false);
    if (total >= 20) out.push({ hazardClass: 'stot-se', category: '3', hStatements: [h], rule: `Σ STOT SE 3 (${h}) = ${fmt(total)} ≥ 20 % → STOT SE 3 (CLP 3.8.3.4.5)` });
  }

  // Generic cut-offs (CLP Annex I; from memory).
  for (const g of GENERIC_CUTOFFS) {
    const hit = relevantAll(s).filter((x) => has(x.data, g.hazardClass, g.ingredientCategories) !== undefined);
    const total = hit.reduce((a, x) => a + x.pct, 0);
    if (hit.length && total >= g.cutoffPct && !out.some((c) => c.hazardClass === g.hazardClass)) {
      const hs = [...new Set(hit.flatMap((x) => has(x.data, g.hazardClass, g.ingredientCategories)!.hStatements))];
      out.push({ hazardClass: g.hazardClass, category: g.mixtureCategory, hStatements: hs, rule: `Σ ${hazardClassLabel(g.hazardClass, g.ingredientCategories.join('/'))} = ${fmt(total)} ≥ ${g.cutoffPct} % → ${hazardClassLabel(g.hazardClass, g.mixtureCategory)} (${g.source})` });
    }
  }

  // Carried over: classes that need a test on the mixture.
  for (const x of relevant) {
    for (const c of x.data?.classifications ?? []) {
      if (!CARRIED_CLASSES.includes(c.hazardClass)) continue;
      if (out.some((o) => o.hazardClass === c.hazardClass && o.rule.startsWith('carried'))) {
        const o = out.find((e) => e.hazardClass === c.hazardClass)!;
        if (categoryRank(c.category) < categoryRank(o.category)) Object.assign(o, { category: c.category, hStatements: c.hStatements });
        o.rule += `; also ${x.name} (${fmt(x.pct)})`;
        continue;
      }
      out.push({
        hazardClass: c.hazardClass,
        category: c.category,
        hStatements: [...c.hStatements],
        rule: `carried over from ${x.name} (${fmt(x.pct)} ≥ 1 %): ${hazardClassLabel(c.hazardClass)} is not classified by arithmetic in a mixture; the UN test on the mixture (GHS ch. 2) decides`,
      });
      notes.push({
        severity: 'caution',
        ruleId: `classification.carried.${c.hazardClass}`,
        title: `${c.hazardClass} ${c.category} carried over from ${x.name}`,
        text: `${x.name} is classified ${c.hazardClass} ${c.category} (${c.hStatements.join(', ')}) and makes up ${fmt(x.pct)} of the fill. This class is not computed for a mixture: the ingredient's class is carried over until the mixture or its compartment is tested.`,
        source: 'UN GHS Rev. 9 ch. 2.12–2.14 (test-based classes; from memory)',
      });
    }
  }

  // Classes present on an ingredient that no rule above looks at.
  const known = new Set([...ACUTE_ROUTES.map((r) => r.hazardClass), 'skin-corr', 'skin-irrit', 'eye-dam', 'eye-irrit', 'stot-se', ...GENERIC_CUTOFFS.map((g) => g.hazardClass), ...CARRIED_CLASSES]);
  for (const x of relevant) {
    for (const c of x.data?.classifications ?? []) {
      if (known.has(c.hazardClass)) continue;
      const id = `classification.not-computed.${c.hazardClass}`;
      if (notes.some((n) => n.ruleId === id)) continue;
      notes.push({
        severity: 'caution',
        ruleId: id,
        title: `${c.hazardClass} not computed`,
        text: `${x.name} (${fmt(x.pct)}) is classified ${c.hazardClass} ${c.category}; this module does not classify that class for mixtures. Review it by hand.`,
        source: MIXTURE_RULES_SOURCE,
      });
    }
  }

  const label = labelElements(out, { consumerProduct: options.consumerProduct ?? true });
  return { classifications: out, ate, label, notes, supplementalStatements: supplemental };
}

function relevantAll(s: Share[]): Share[] {
  return s; // generic cut-offs go below 1 % (0.1 % for CMR 1)
}

function categoryRank(cat: string): number {
  const n = Number.parseInt(cat, 10);
  return (Number.isFinite(n) ? n : 9) * 10 + (cat.length > 1 ? cat.charCodeAt(1) - 64 : 0);
}

/** Classes that need a test on the mixture and are carried over from an ingredient ≥ 1 %. */
export const CARRIED_CLASSES: readonly string[] = ['ox-sol', 'ox-liq', 'water-react', 'flam-sol', 'pyr-sol', 'self-heat', 'met-corr', 'expl'];

interface GenericCutoff {
  hazardClass: string;
  ingredientCategories: readonly string[];
  cutoffPct: number;
  mixtureCategory: string;
  source: string;
}

/** Generic concentration limits (CLP Annex I; from memory). The first that matches a class wins. */
export const GENERIC_CUTOFFS: readonly GenericCutoff[] = [
  { hazardClass: 'carc', ingredientCategories: ['1A', '1B'], cutoffPct: 0.1, mixtureCategory: '1B', source: 'CLP Table 3.6.2' },
  { hazardClass: 'carc', ingredientCategories: ['2'], cutoffPct: 1, mixtureCategory: '2', source: 'CLP Table 3.6.2' },
  { hazardClass: 'muta', ingredientCategories: ['1A', '1B'], cutoffPct: 0.1, mixtureCategory: '1B', source: 'CLP Table 3.5.2' },
  { hazardClass: 'muta', ingredientCategories: ['2'], cutoffPct: 1, mixtureCategory: '2', source: 'CLP Table 3.5.2' },
  { hazardClass: 'repr', ingredientCategories: ['1A', '1B'], cutoffPct: 0.3, mixtureCategory: '1B', source: 'CLP Table 3.7.2' },
  { hazardClass: 'repr', ingredientCategories: ['2'], cutoffPct: 3, mixtureCategory: '2', source: 'CLP Table 3.7.2' },
  { hazardClass: 'skin-sens', ingredientCategories: ['1', '1A', '1B'], cutoffPct: 1, mixtureCategory: '1', source: 'CLP Table 3.4.5' },
  { hazardClass: 'resp-sens', ingredientCategories: ['1', '1A', '1B'], cutoffPct: 1, mixtureCategory: '1', source: 'CLP Table 3.4.5 (solids)' },
  { hazardClass: 'stot-re', ingredientCategories: ['1'], cutoffPct: 10, mixtureCategory: '1', source: 'CLP Table 3.9.4' },
  { hazardClass: 'stot-re', ingredientCategories: ['1', '2'], cutoffPct: 1, mixtureCategory: '2', source: 'CLP Table 3.9.4' },
  { hazardClass: 'stot-se', ingredientCategories: ['1'], cutoffPct: 10, mixtureCategory: '1', source: 'CLP Table 3.8.3' },
  { hazardClass: 'stot-se', ingredientCategories: ['1', '2'], cutoffPct: 1, mixtureCategory: '2', source: 'CLP Table 3.8.3' },
];

// --- label elements ---------------------------------------------------------------------------

interface PictogramOf {
  code: LabelElements['pictograms'][number] | null;
  signal: 'Danger' | 'Warning' | null;
}

/**
 * Pictogram and signal word of a class and category (UN GHS Annex 1 / CLP Annex I tables; from memory).
 *
 * @example pictogramOf('acute-tox-oral', '3') // → { code: 'GHS06', signal: 'Danger' }
 */
export function pictogramOf(hazardClass: string, category: string): PictogramOf {
  const n = Number.parseInt(category, 10);
  switch (hazardClass) {
    case 'acute-tox-oral':
    case 'acute-tox-dermal':
    case 'acute-tox-inhal':
      return n <= 3 ? { code: 'GHS06', signal: 'Danger' } : n === 4 ? { code: 'GHS07', signal: 'Warning' } : { code: null, signal: 'Warning' };
    case 'skin-corr':
    case 'eye-dam':
      return { code: 'GHS05', signal: 'Danger' };
    case 'met-corr':
      return { code: 'GHS05', signal: 'Warning' };
    case 'skin-irrit':
      return n === 2 ? { code: 'GHS07', signal: 'Warning' } : { code: null, signal: 'Warning' };
    case 'eye-irrit':
      return category === '2B' ? { code: null, signal: 'Warning' } : { code: 'GHS07', signal: 'Warning' };
    case 'stot-se':
      return n === 3 ? { code: 'GHS07', signal: 'Warning' } : { code: 'GHS08', signal: n === 1 ? 'Danger' : 'Warning' };
    case 'stot-re':
    case 'carc':
    case 'muta':
    case 'repr':
      return { code: 'GHS08', signal: n === 1 ? 'Danger' : 'Warning' };
    case 'resp-sens':
      return { code: 'GHS08', signal: 'Danger' };
    case 'skin-sens':
      return { code: 'GHS07', signal: 'Warning' };
    case 'ox-sol':
    case 'ox-liq':
      return { code: 'GHS03', signal: n <= 2 ? 'Danger' : 'Warning' };
    case 'flam-sol':
      return { code: 'GHS02', signal: n === 1 ? 'Danger' : 'Warning' };
    case 'water-react':
    case 'self-heat':
      return { code: 'GHS02', signal: n <= 2 && hazardClass === 'water-react' ? 'Danger' : n === 1 ? 'Danger' : 'Warning' };
    case 'pyr-sol':
      return { code: 'GHS02', signal: 'Danger' };
    case 'expl':
      return { code: 'GHS01', signal: 'Danger' };
    case 'aquatic-acute':
      return { code: 'GHS09', signal: 'Warning' };
    case 'aquatic-chronic':
      return n === 1 ? { code: 'GHS09', signal: 'Warning' } : n === 2 ? { code: 'GHS09', signal: null } : { code: null, signal: null };
    default:
      return { code: null, signal: null };
  }
}

/**
 * Label elements of a classified mixture:
 * - pictograms by class ({@link pictogramOf}), with the precedence rules of CLP Art. 26(1) /
 *   GHS 1.4.10.5.3.1: GHS06 present → no GHS07; GHS05 present → no GHS07 where GHS07 would only
 *   mark skin or eye irritation; GHS08 for respiratory sensitisation → no GHS07 for skin
 *   sensitisation or skin/eye irritation; GHS01 present → GHS02 and GHS03 optional (kept here);
 * - signal word: Danger when any class carries Danger, else Warning (CLP Art. 20(3));
 * - H-statements de-duplicated and ordered; H318 dropped beside H314, H319 beside H318 or H314,
 *   H315 beside H314 (CLP Art. 27: evident duplication);
 * - P-statements from {@link pStatementsFor}, plus P102 for a consumer product with any class.
 *
 * @example labelElements([{ hazardClass: 'eye-irrit', category: '2', hStatements: ['H319'] }]).pictograms // → ['GHS07']
 */
export function labelElements(classes: readonly GhsClassification[], options: { consumerProduct?: boolean } = {}): LabelElements {
  const reasons = new Map<string, Set<string>>();
  let signal: 'Danger' | 'Warning' | null = null;
  for (const c of classes) {
    const p = pictogramOf(c.hazardClass, c.category);
    if (p.code) {
      if (!reasons.has(p.code)) reasons.set(p.code, new Set());
      reasons.get(p.code)!.add(c.hazardClass);
    }
    if (p.signal === 'Danger') signal = 'Danger';
    else if (p.signal === 'Warning' && signal === null) signal = 'Warning';
  }
  const irritationOnly = (rs: Set<string>, allowed: readonly string[]) => [...rs].every((r) => allowed.includes(r));
  const ghs07 = reasons.get('GHS07');
  if (ghs07) {
    const respSens = classes.some((c) => c.hazardClass === 'resp-sens');
    if (reasons.has('GHS06')) reasons.delete('GHS07');
    else if (reasons.has('GHS05') && irritationOnly(ghs07, ['skin-irrit', 'eye-irrit'])) reasons.delete('GHS07');
    else if (respSens && irritationOnly(ghs07, ['skin-irrit', 'eye-irrit', 'skin-sens'])) reasons.delete('GHS07');
  }
  const pictograms = [...reasons.keys()].sort() as LabelElements['pictograms'];
  let h = orderStatementCodes(classes.flatMap((c) => c.hStatements));
  if (h.includes('H314')) h = h.filter((x) => x !== 'H318' && x !== 'H315');
  if (h.includes('H314') || h.includes('H318')) h = h.filter((x) => x !== 'H319');
  let p = pStatementsFor(classes);
  if (classes.length > 0 && (options.consumerProduct ?? true)) p = orderStatementCodes([P_KEEP_OUT_OF_REACH_OF_CHILDREN, ...p]);
  return { pictograms, signalWord: signal, hStatements: h, pStatements: p };
}
