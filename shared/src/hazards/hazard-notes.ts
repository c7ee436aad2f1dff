import { molarMass } from '../chemistry/formula';
import type { HazardNote, HazardSeverity, IngredientHazardData } from '../schemas/hazards';
import type { IngredientProcessInput } from '../thermal/process';
import type { ClassifiedEntry } from './mixture-classification';
import { pictogramOf } from './mixture-classification';

/**
 * The hazard-note rules: each a small pure function returning zero or more notes with a stable
 * rule id, a severity and a source. Severity scale (DEVELOPERS.md, "Hazard notes"):
 * - info: worth knowing, no action implied;
 * - caution: a usual precaution applies (label text, instructions for use);
 * - warning: a threshold is reached; the design needs a specific safeguard or a qualified decision;
 * - blocker: the design as given cannot be used safely (e.g. a sealed pack that cannot hold its gas).
 * Thresholds below are published values written from memory unless marked otherwise; the notes
 * inform a design and defer to local codes, the safety data sheets and qualified review.
 */

/** How the pack meets the skin in use. `possible`: held in the hand or laid on skin; `none`: kept in a carrier. */
export type SkinContact = 'direct' | 'through-fabric' | 'possible' | 'none';

const note = (severity: HazardSeverity, ruleId: string, title: string, text: string, source: string): HazardNote => ({ severity, ruleId, title, text, source });
const r1 = (x: number) => Number(x.toFixed(1));

// --- skin contact: heat ----------------------------------------------------------------------

export const BURN_THRESHOLD_SOURCE =
  'ISO 13732-1:2006, burn thresholds for contact with hot surfaces (≥ 1 min: 51 °C at 1 min, 48 °C at 10 min, 43 °C at 8 h; from memory); Moritz & Henriques, Am. J. Pathol. 23 (1947) 695 for short contact (about 60 °C in ~3 s, 70 °C in ~1 s; from memory)';

/** (contact time min, burn threshold °C) pairs; log-linear in time between them. */
export const BURN_THRESHOLD_POINTS: readonly (readonly [number, number])[] = [
  [1 / 60, 70],
  [0.05, 60],
  [1, 51],
  [10, 48],
  [480, 43],
];

/**
 * Skin burn threshold for a contact time: the surface temperature at which a burn may begin,
 * interpolated linearly in log(time) between {@link BURN_THRESHOLD_POINTS}; constant outside.
 * Source: {@link BURN_THRESHOLD_SOURCE}.
 *
 * @example burnThresholdC(10) // → 48
 * @example burnThresholdC(120) // → ≈ 44.8
 */
export function burnThresholdC(contactMin: number): number {
  if (!(contactMin > 0)) throw new Error(`expected a contact time > 0 min; found ${contactMin}`);
  const pts = BURN_THRESHOLD_POINTS;
  if (contactMin <= pts[0]![0]) return pts[0]![1];
  for (let i = 1; i < pts.length; i++) {
    const [t1, T1] = pts[i]!;
    if (contactMin <= t1) {
      const [t0, T0] = pts[i - 1]!;
      return T0 + ((T1 - T0) * Math.log(contactMin / t0)) / Math.log(t1 / t0);
    }
  }
  return pts[pts.length - 1]![1];
}

/** Within this many kelvin below the burn threshold, with contact of at least an hour: the low-temperature burn caution. */
export const LOW_TEMPERATURE_BURN_MARGIN_K = 3;
/** Above this, a burn follows in about a second (Moritz & Henriques 1947, from memory): on-skin designs are blocked. */
export const INSTANT_BURN_C = 70;

/**
 * Rule `skin.burn` / `skin.low-temperature-burn` / `skin.hot-surface`: the predicted peak
 * temperature against the burn threshold for the contact time.
 * - skin contact (direct, through fabric, possible): peak ≥ {@link INSTANT_BURN_C} → blocker; peak ≥
 *   threshold(contactMin) → warning; threshold − 3 K ≤ peak < threshold with contact ≥ 60 min →
 *   caution (low-temperature burns after long contact at moderate temperature, e.g. warmers in
 *   bed or on the immobile, infants, the elderly, people with reduced sensation);
 * - no skin contact: peak ≥ threshold(1 min) = 51 °C → caution (hot to handle).
 * Through fabric the skin is cooler than the pack surface; the check still uses the pack
 * temperature (conservative).
 *
 * @example skinHeatNotes({ maxTempC: 46, contactMin: 120, skinContact: 'direct' })[0].severity // → 'warning'
 */
export function skinHeatNotes(p: { maxTempC: number; contactMin: number; skinContact: SkinContact }): HazardNote[] {
  const { maxTempC: T, contactMin, skinContact } = p;
  if (skinContact === 'none') {
    const t1 = burnThresholdC(1);
    return T >= t1
      ? [note('caution', 'skin.hot-surface', 'Hot to handle', `The pack peaks at ${r1(T)} °C, at or above the ${t1} °C burn threshold for 1 min of contact: handle with care and keep it away from skin.`, BURN_THRESHOLD_SOURCE)]
      : [];
  }
  const thr = burnThresholdC(contactMin);
  const how = skinContact === 'through-fabric' ? 'through fabric' : skinContact === 'direct' ? 'on bare skin' : 'if held against skin';
  if (T >= INSTANT_BURN_C) {
    return [note('blocker', 'skin.burn', 'Burns on contact', `The pack peaks at ${r1(T)} °C; at ${INSTANT_BURN_C} °C and above skin burns in about a second. Not usable ${how}.`, BURN_THRESHOLD_SOURCE)];
  }
  if (T >= thr) {
    return [
      note(
        'warning',
        'skin.burn',
        'Burn threshold reached',
        `The pack peaks at ${r1(T)} °C; for ${r1(contactMin)} min of contact ${how} the burn threshold is about ${r1(thr)} °C. Lower the peak, add insulation, or limit the contact time in the instructions.`,
        BURN_THRESHOLD_SOURCE,
      ),
    ];
  }
  if (contactMin >= 60 && T >= thr - LOW_TEMPERATURE_BURN_MARGIN_K) {
    return [
      note(
        'caution',
        'skin.low-temperature-burn',
        'Low-temperature burn with long contact',
        `The pack holds up to ${r1(T)} °C for about ${r1(contactMin)} min, within ${LOW_TEMPERATURE_BURN_MARGIN_K} K of the ${r1(thr)} °C burn threshold for that time. Long contact at moderate temperature can burn (asleep, immobile, infants, elderly, reduced sensation): use over clothing, not on bare skin, and say so on the label.`,
        BURN_THRESHOLD_SOURCE,
      ),
    ];
  }
  return [];
}

// --- skin contact: cold ----------------------------------------------------------------------

export const COLD_THRESHOLD_SOURCE =
  'ISO 13732-3:2008, touching cold surfaces: skin contact temperature criteria of about 15 °C (pain), 7 °C (numbness) and 0 °C (frostbite) (from memory); the 20-minute limit of a cold application is common first-aid practice';
export const FROSTBITE_C = 0;
export const NUMBNESS_C = 7;
export const COLD_PAIN_C = 15;
export const COLD_APPLICATION_LIMIT_MIN = 20;

/**
 * Rule `skin.cold.frostbite` / `skin.cold.numbness` / `skin.cold.pain` / `skin.cold.handling`:
 * the predicted minimum against the cold-injury criteria of ISO 13732-3 (from memory).
 * - skin contact: min < 0 °C → warning (frostbite; a barrier cloth and a time limit are needed);
 *   0 ≤ min < 7 °C → caution (numbness; a barrier and ≤ 20 min per application), raised to
 *   warning when the contact time exceeds 20 min; 7 ≤ min < 15 °C → info (pain threshold);
 * - no skin contact: min < 0 °C → caution (frostbite on handling).
 *
 * @example skinColdNotes({ minTempC: -3, contactMin: 15, skinContact: 'direct' })[0].ruleId // → 'skin.cold.frostbite'
 */
export function skinColdNotes(p: { minTempC: number; contactMin: number; skinContact: SkinContact }): HazardNote[] {
  const { minTempC: T, contactMin, skinContact } = p;
  if (skinContact === 'none') {
    return T < FROSTBITE_C
      ? [note('caution', 'skin.cold.handling', 'Below freezing', `The pack gets down to ${r1(T)} °C: frostbite is possible if held against skin; handle with gloves.`, COLD_THRESHOLD_SOURCE)]
      : [];
  }
  if (T < FROSTBITE_C) {
    return [
      note('warning', 'skin.cold.frostbite', 'Frostbite risk', `The pack gets down to ${r1(T)} °C, below the ${FROSTBITE_C} °C frostbite criterion: skin in contact can freeze. Use a barrier cloth, limit each application, and warn on the label.`, COLD_THRESHOLD_SOURCE),
    ];
  }
  if (T < NUMBNESS_C) {
    const long = contactMin > COLD_APPLICATION_LIMIT_MIN;
    return [
      note(
        long ? 'warning' : 'caution',
        'skin.cold.numbness',
        'Cold injury with long contact',
        `The pack gets down to ${r1(T)} °C, below the ${NUMBNESS_C} °C numbness criterion. ${long ? `The planned ${r1(contactMin)} min of contact exceeds the usual ${COLD_APPLICATION_LIMIT_MIN} min per application.` : ''} Use a cloth between pack and skin and limit each application to ${COLD_APPLICATION_LIMIT_MIN} min.`.replace('  ', ' '),
        COLD_THRESHOLD_SOURCE,
      ),
    ];
  }
  if (T < COLD_PAIN_C) {
    return [note('info', 'skin.cold.pain', 'Cold to the touch', `The pack gets down to ${r1(T)} °C, below the ${COLD_PAIN_C} °C cold-pain criterion: it may hurt on bare skin.`, COLD_THRESHOLD_SOURCE)];
  }
  return [];
}

// --- gases -----------------------------------------------------------------------------------

/** Molar volume of an ideal gas at 25 °C and 1 atm, L/mol: R·T/P = 8.314462618 × 298.15 / 101325 × 1000 ≈ 24.465 (CODATA R). */
export const MOLAR_VOLUME_25C_L_PER_MOL = ((8.314462618 * 298.15) / 101325) * 1000;

export const HYDROGEN_SOURCE = 'hydrogen flammable range in air 4–75 % by volume (NFPA 68 / CRC Handbook, flammability limits; from memory)';
export const HYDROGEN_LFL_PCT = 4;
export const HYDROGEN_UFL_PCT = 75;
export const AMMONIA_SOURCE =
  'ammonia: 25 ppm 8-h TWA (ACGIH TLV / NIOSH REL), 35 ppm STEL, 300 ppm IDLH (NIOSH Pocket Guide; from memory); odour noticeable from about 5 ppm';
export const AMMONIA_TWA_PPM = 25;
export const AMMONIA_IDLH_PPM = 300;
/** Room volume over which released ammonia is spread for the ppm estimate: 1 m³, the air near the user's face (assumption). */
export const AMMONIA_DILUTION_M3 = 1;

export interface GasEvolved {
  /** Species key, e.g. `H2(g)`, `NH3(g)`. */
  species: string;
  mol: number;
  /** At 25 °C and 1 atm. */
  litres: number;
  /** The ingredient whose reaction evolves it. */
  from: string;
}

export interface GasComponent {
  name: string;
  massG: number;
  process?: IngredientProcessInput | null;
}

/** The species a component brings: its ingredient/solid key, or the water of a water ingredient. */
function speciesOf(c: GasComponent): string | null {
  const p = c.process;
  if (!p) return null;
  if (p.kind === 'dissolution') return p.solidKey;
  if (p.kind === 'reaction') return p.ingredientKey;
  if (p.kind === 'inert' && p.role === 'water') return 'H2O(l)';
  return null;
}

const bare = (key: string) => key.replace(/\([a-z]+\)$/, '');

/**
 * Gas evolved by the composition's reactions, moles and litres at 25 °C and 1 atm (V = n ×
 * {@link MOLAR_VOLUME_25C_L_PER_MOL}). For each reaction process: extent ξ = min over reactants
 * of (moles available / coefficient), where the ingredient itself gives massG / M, another
 * reactant counts when a component brings that species (its solid key, or water), and a
 * reactant no component brings is assumed in excess (the process schema's `limiting` basis);
 * each gas product gives ξ × its coefficient.
 *
 * @example gasesEvolved([{ name: 'Mg', massG: 24.305, process: mgReaction }, { name: 'water', massG: 100, process: water }])
 * // → [{ species: 'H2(g)', mol: 1, litres: 24.465, from: 'Mg' }]
 */
export function gasesEvolved(components: readonly GasComponent[]): GasEvolved[] {
  const available = new Map<string, number>();
  for (const c of components) {
    const k = speciesOf(c);
    if (k) available.set(k, (available.get(k) ?? 0) + c.massG / molarMass(bare(k)));
  }
  const out: GasEvolved[] = [];
  for (const c of components) {
    const p = c.process;
    if (!p || p.kind !== 'reaction' || !(c.massG > 0)) continue;
    const gases = p.products.filter((t) => t.key.endsWith('(g)'));
    if (!gases.length) continue;
    let extent = Number.POSITIVE_INFINITY;
    for (const r of p.reactants) {
      const mol = r.key === p.ingredientKey ? c.massG / molarMass(bare(r.key)) : available.get(r.key);
      if (mol === undefined) continue;
      extent = Math.min(extent, mol / r.coef);
    }
    if (!Number.isFinite(extent)) continue;
    for (const g of gases) {
      const mol = extent * g.coef;
      out.push({ species: g.key, mol, litres: mol * MOLAR_VOLUME_25C_L_PER_MOL, from: c.name });
    }
  }
  return out;
}

/**
 * Rules `gas.hydrogen.flammable`, `gas.hydrogen`, `gas.ammonia`, `gas.overpressure`:
 * - hydrogen: share in the headspace, x = V_H2 / (V_H2 + V_headspace) × 100 %; x ≥ LFL 4 % →
 *   warning (a flammable mixture forms in the pack and its vent plume; keep ignition sources
 *   away, vent), else caution;
 * - ammonia: ppm if spread in {@link AMMONIA_DILUTION_M3} m³ of air, c = V_NH3 / 1000 L × 10⁶;
 *   c ≥ IDLH 300 ppm → warning; c ≥ TWA 25 ppm → caution; else info;
 * - any gas with total volume > the headspace: a sealed pack would more than double its
 *   pressure → blocker when not vented, caution when vented (the vent plume).
 *
 * @example gasNotes({ gases: [{ species: 'H2(g)', mol: 0.1, litres: 2.45, from: 'Mg' }], headspaceL: 0.02, vented: true })
 * // → hydrogen warning (99 % > 4 % LFL) and overpressure caution
 */
export function gasNotes(p: { gases: readonly GasEvolved[]; headspaceL: number; vented: boolean }): HazardNote[] {
  const notes: HazardNote[] = [];
  const byGas = (sp: string) => p.gases.filter((g) => g.species === sp).reduce((a, g) => a + g.litres, 0);
  const h2 = byGas('H2(g)');
  if (h2 > 0) {
    const x = (100 * h2) / (h2 + p.headspaceL);
    const flammable = x >= HYDROGEN_LFL_PCT - 1e-9; // rounding of V/(V + H) at exactly 4 %
    notes.push(
      note(
        flammable ? 'warning' : 'caution',
        flammable ? 'gas.hydrogen.flammable' : 'gas.hydrogen',
        'Hydrogen evolved',
        `About ${r1(h2)} L of hydrogen (25 °C, 1 atm) is evolved; in the ${r1(p.headspaceL * 1000)} mL headspace that is ${r1(x)} % by volume, ${flammable ? 'inside' : 'below'} the flammable range of ${HYDROGEN_LFL_PCT}–${HYDROGEN_UFL_PCT} % in air. Vent it away from flames and sparks; never in a closed space.`,
        HYDROGEN_SOURCE,
      ),
    );
  }
  const nh3 = byGas('NH3(g)');
  if (nh3 > 0) {
    const ppm = (nh3 / (AMMONIA_DILUTION_M3 * 1000)) * 1e6;
    const sev: HazardSeverity = ppm >= AMMONIA_IDLH_PPM ? 'warning' : ppm >= AMMONIA_TWA_PPM ? 'caution' : 'info';
    notes.push(
      note(
        sev,
        'gas.ammonia',
        'Ammonia evolved',
        `About ${r1(nh3)} L of ammonia (25 °C, 1 atm) is evolved; spread in ${AMMONIA_DILUTION_M3} m³ of air near the user (assumption) that is about ${Math.round(ppm)} ppm, against ${AMMONIA_TWA_PPM} ppm (8-h limit) and ${AMMONIA_IDLH_PPM} ppm (immediately dangerous). Toxic and irritating to eyes and airways.`,
        AMMONIA_SOURCE,
      ),
    );
  }
  const total = p.gases.reduce((a, g) => a + g.litres, 0);
  if (total > p.headspaceL) {
    notes.push(
      note(
        p.vented ? 'caution' : 'blocker',
        'gas.overpressure',
        p.vented ? 'Gas vents from the pack' : 'A sealed pack cannot hold its gas',
        `${r1(total)} L of gas against a ${r1(p.headspaceL * 1000)} mL headspace: ${p.vented ? 'the vent must stay clear and point away from the user.' : 'a sealed pack would more than double its pressure and may burst. Vent it, or choose a chemistry without gas.'}`,
        'ideal gas at 25 °C and 1 atm (pV = nRT); headspace as given or estimated',
      ),
    );
  }
  return notes;
}

// --- incompatible pairs ----------------------------------------------------------------------

export interface GroupedComponent {
  name: string;
  massG: number;
  hazardData: IngredientHazardData | null;
  /** True for the water (solvent) of the pack. */
  isWater?: boolean;
}

export const INCOMPATIBILITY_SOURCE = 'incompatible-materials sections (section 10) of the ingredients\' safety data sheets; Bretherick\'s Handbook of Reactive Chemical Hazards (general rules; from memory)';

/**
 * Rules `incompat.oxidiser-fuel` (warning), `incompat.water-reactive` (caution: usually the
 * intended reaction; keep dry and apart until activation), `incompat.acid-base` (caution: heat,
 * and ammonia when the acid is an ammonium salt), by the ingredients' incompatibility groups.
 * Only ingredients with mass > 0 count.
 *
 * @example incompatibilityNotes([{ name: 'AN', massG: 1, hazardData: oxidiser }, { name: 'Fe', massG: 1, hazardData: fuel }])[0].ruleId
 * // → 'incompat.oxidiser-fuel'
 */
export function incompatibilityNotes(components: readonly GroupedComponent[]): HazardNote[] {
  const present = components.filter((c) => c.massG > 0);
  const inGroup = (...g: string[]) => present.filter((c) => c.hazardData?.incompatibilityGroups.some((x) => g.includes(x))).map((c) => c.name);
  const notes: HazardNote[] = [];
  const ox = inGroup('oxidiser');
  const fuel = inGroup('fuel', 'reducing-agent').filter((n) => !ox.includes(n));
  if (ox.length && fuel.length) {
    notes.push(
      note('warning', 'incompat.oxidiser-fuel', 'Oxidiser with a fuel', `${ox.join(', ')} (oxidiser) and ${fuel.join(', ')} (fuel or reducing agent) in one pack: the mixture can burn fiercely once ignited. Keep them apart or drop one.`, INCOMPATIBILITY_SOURCE),
    );
  }
  const wr = inGroup('water-reactive');
  const water = present.some((c) => c.isWater);
  if (wr.length && water) {
    notes.push(
      note('caution', 'incompat.water-reactive', 'Water-reactive with water', `${wr.join(', ')} react${wr.length === 1 ? 's' : ''} with the pack's water. Keep the compartments apart and the solid dry until activation; a leak in storage starts the reaction.`, INCOMPATIBILITY_SOURCE),
    );
  }
  const acids = inGroup('acid');
  const bases = inGroup('base').filter((n) => !acids.includes(n));
  if (acids.length && bases.length) {
    notes.push(
      note('caution', 'incompat.acid-base', 'Acid with a base', `${acids.join(', ')} (acidic) and ${bases.join(', ')} (base) in one pack: they neutralise with heat; an ammonium salt with a strong base releases ammonia.`, INCOMPATIBILITY_SOURCE),
    );
  }
  return notes;
}

// --- precursors --------------------------------------------------------------------------------

export const AN_PRECURSOR_SOURCE = 'Regulation (EU) 2019/1148 on explosives precursors, Annex I: ammonium nitrate, limit value 16 % by weight of nitrogen in relation to ammonium nitrate (from memory)';
export const AN_NITROGEN_LIMIT = 0.16;
/** Mass fraction of nitrogen in NH4NO3: 2 × 14.007 / 80.043 ≈ 0.350 (CIAAW 2021 atomic weights). */
export const AN_NITROGEN_MASS_FRACTION = (2 * molarMass('N')) / molarMass('NH4NO3');

/**
 * Nitrogen from ammonium nitrate as a mass fraction of the fill: w_N = w_AN × 0.350.
 *
 * @example anNitrogenFraction(50, 100) // → 0.175
 */
export function anNitrogenFraction(anMassG: number, fillMassG: number): number {
  if (!(fillMassG > 0)) throw new Error(`expected a fill mass > 0 g; found ${fillMassG}`);
  return (anMassG / fillMassG) * AN_NITROGEN_MASS_FRACTION;
}

/** The highest AN mass fraction of the fill that stays below the 16 % N limit: 0.16 / 0.350 ≈ 0.457. */
export const AN_MAX_MASS_FRACTION = AN_NITROGEN_LIMIT / AN_NITROGEN_MASS_FRACTION;

/**
 * Rules `precursor.an-nitrogen` and `precursor.reportable`:
 * - ingredients flagged `eu-2019-1148-an`: N from AN in the fill ≥ 16 % → warning (restricted
 *   precursor: in the EU not to be made available to the general public; jurisdiction decides,
 *   so not a blocker here); below → info. Either way the note reminds that a compartment holding
 *   the solid alone is at 35 % N;
 * - ingredients flagged `eu-2019-1148-annex-ii`: caution (reportable precursor).
 *
 * @example precursorNotes([{ name: 'AN', massG: 50, hazardData: an }, { name: 'water', massG: 50, hazardData: null }])[0].severity // → 'warning' (17.5 % N)
 */
export function precursorNotes(components: readonly GroupedComponent[]): HazardNote[] {
  const fill = components.reduce((a, c) => a + c.massG, 0);
  if (!(fill > 0)) return [];
  const flagged = (code: string) => components.filter((c) => c.massG > 0 && c.hazardData?.regulatoryFlags.some((f) => f.code === code));
  const notes: HazardNote[] = [];
  const an = flagged('eu-2019-1148-an');
  if (an.length) {
    const w = anNitrogenFraction(
      an.reduce((a, c) => a + c.massG, 0),
      fill,
    );
    const over = w >= AN_NITROGEN_LIMIT;
    notes.push(
      note(
        over ? 'warning' : 'info',
        'precursor.an-nitrogen',
        over ? 'Ammonium nitrate above the precursor limit' : 'Ammonium nitrate below the precursor limit',
        `Nitrogen from ammonium nitrate is ${r1(w * 100)} % of the fill by weight, ${over ? 'at or above' : 'below'} the 16 % limit. ${over ? 'In the EU such a mixture may not be made available to members of the general public; ' : ''}A compartment holding the solid alone is at ${r1(AN_NITROGEN_MASS_FRACTION * 100)} % N. Check the rules of every market the pack is sold in.`,
        AN_PRECURSOR_SOURCE,
      ),
    );
  }
  const rep = flagged('eu-2019-1148-annex-ii');
  if (rep.length) {
    notes.push(
      note('caution', 'precursor.reportable', 'Reportable explosives precursor', `${rep.map((c) => c.name).join(', ')}: listed in Annex II of Regulation (EU) 2019/1148; suspicious transactions, disappearances and thefts are reported.`, 'Regulation (EU) 2019/1148, Annex II (from memory)'),
    );
  }
  return notes;
}

// --- ingestion, child access, disposal ---------------------------------------------------------

export const CHILD_ACCESS_SOURCE =
  'CLP Annex IV Part 1 P102 and Annex II 3.1 (child-resistant fastenings for consumer mixtures classified Acute Tox. 1–3, STOT SE 1, STOT RE 1 or Skin Corr. 1; tactile warning for further classes; from memory)';

/**
 * Rule `ingestion.child-access`: on the mixture's classification —
 * acute tox 1–3 or Skin Corr. 1 → warning (child-resistant packaging applies to consumer
 * mixtures so classified); any other acute toxicity, Eye Dam. 1 or any health class with a
 * GHS05/GHS06/GHS07 pictogram → caution ("keep out of reach of children", P102);
 * otherwise info (not for ingestion).
 *
 * @example ingestionNotes([{ hazardClass: 'acute-tox-oral', category: '3', hStatements: ['H301'], rule: '' }])[0].severity // → 'warning'
 */
export function ingestionNotes(classification: readonly ClassifiedEntry[]): HazardNote[] {
  const acute = classification.filter((c) => c.hazardClass.startsWith('acute-tox'));
  const severe = acute.some((c) => Number.parseInt(c.category, 10) <= 3) || classification.some((c) => c.hazardClass === 'skin-corr');
  const health = classification.some((c) => {
    const p = pictogramOf(c.hazardClass, c.category).code;
    return (p === 'GHS05' || p === 'GHS06' || p === 'GHS07' || p === 'GHS08') && c.hazardClass !== 'met-corr';
  });
  if (severe) {
    return [note('warning', 'ingestion.child-access', 'Toxic or corrosive if swallowed', 'The mixture is classified acutely toxic (category 1–3) or corrosive: keep out of reach of children (P102); consumer packs need child-resistant packaging and a tactile warning. Not for ingestion.', CHILD_ACCESS_SOURCE)];
  }
  if (health || acute.length) {
    return [note('caution', 'ingestion.child-access', 'Keep out of reach of children', 'The mixture carries a health classification: keep out of reach of children and pets (P102); do not eat the contents; rinse the mouth and seek medical advice if swallowed.', CHILD_ACCESS_SOURCE)];
  }
  return [note('info', 'ingestion.child-access', 'Not for ingestion', 'Do not eat the contents; keep away from small children, who may bite through the pouch.', 'common practice for consumer thermal packs')];
}

/**
 * Rule `disposal` (always info): dispose of used packs by local rules (P501); contents that are
 * classified, oxidising or heavy-metal salts go as chemical waste, not down the drain.
 *
 * @example disposalNotes([]).map((n) => n.severity) // → ['info']
 */
export function disposalNotes(classification: readonly ClassifiedEntry[], names: readonly string[] = []): HazardNote[] {
  const barium = names.some((n) => /barium/i.test(n));
  const classified = classification.length > 0;
  const text = classified || barium
    ? `Dispose of used and unused packs and their contents according to local regulations (P501)${barium ? '; soluble barium salts are hazardous waste' : ''}; do not empty classified contents into drains or the environment.`
    : 'Dispose of used packs with household waste unless local rules say otherwise; the contents are not classified.';
  return [note('info', 'disposal', 'Disposal', text, 'UN GHS Annex 3, P501 (from memory); local waste rules decide')];
}

// --- score --------------------------------------------------------------------------------------

export const SEVERITY_WEIGHTS: Readonly<Record<HazardSeverity, number>> = { blocker: 100, warning: 10, caution: 3, info: 0 };
/** Weight of each mixture class by the signal word its category carries: Danger 10, Warning 3, none 1. */
export const CLASS_WEIGHTS = { Danger: 10, Warning: 3, none: 1 } as const;

/**
 * The hazard score: a simple documented weighting, 0 for nothing to note, growing with severity.
 *   score = Σ_notes w(severity) + Σ_classes w(signal word)
 * w(severity): blocker 100, warning 10, caution 3, info 0; w(class): Danger 10, Warning 3,
 * none 1 (by {@link pictogramOf}). A design choice of Packwright, not a published index.
 *
 * @example hazardScore([{ severity: 'warning', … }], [{ hazardClass: 'eye-irrit', category: '2', … }]) // → 13
 */
export function hazardScore(notes: readonly Pick<HazardNote, 'severity'>[], classification: readonly { hazardClass: string; category: string }[]): number {
  let s = 0;
  for (const n of notes) s += SEVERITY_WEIGHTS[n.severity];
  for (const c of classification) {
    const w = pictogramOf(c.hazardClass, c.category).signal;
    s += w === 'Danger' ? CLASS_WEIGHTS.Danger : w === 'Warning' ? CLASS_WEIGHTS.Warning : CLASS_WEIGHTS.none;
  }
  return s;
}
