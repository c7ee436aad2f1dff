import type { Candidate } from '@shared/schemas/briefs';

/**
 * Figures of an optimiser candidate as the screens show them. Shared here because the run page
 * and the compare page both read them.
 */

/** An ingredient's name without its grade: "Ammonium nitrate (Prilled, …)" → "Ammonium nitrate". */
export function shortIngredientName(name: string): string {
  return name.replace(/\s*\(.*\)\s*$/, '').trim() || name;
}

/** The chemistry of a candidate in a few words: "Ammonium nitrate + Urea". */
export function chemistryName(c: Pick<Candidate, 'setNames'>): string {
  return c.setNames.map(shortIngredientName).join(' + ') || 'No actives';
}

/** The active present in the largest mass: the colour group of a candidate on the trade-off plot. */
export function leadActive(c: Pick<Candidate, 'composition' | 'setNames'>): string {
  const actives = c.composition.filter((e) => e.role === 'active').sort((a, b) => b.massG - a.massG);
  return shortIngredientName(actives[0]?.name ?? c.setNames[0] ?? 'No actives');
}

/** Hold margin, min: the time model's when the candidate was verified, else the linear model's. */
export function holdMarginMin(c: Pick<Candidate, 'verification' | 'predictedHoldMarginMin'>): number | null {
  return c.verification.holdMarginMin ?? c.predictedHoldMarginMin;
}

/** The predicted extreme: the coldest a cold pack gets, the warmest a warm one does, °C. */
export function extremeTempC(c: Pick<Candidate, 'predictedMinTempC' | 'predictedMaxTempC' | 'predictedExtremeTempC'>, packType: 'cold' | 'warm'): number {
  const v = packType === 'cold' ? c.predictedMinTempC : c.predictedMaxTempC;
  return v ?? c.predictedExtremeTempC;
}

export const VERIFICATION_WORDS: Record<Candidate['verification']['status'], { label: string; tone: 'success' | 'danger' | 'neutral' | 'caution' }> = {
  passed: { label: 'Meets the brief', tone: 'success' },
  missed: { label: 'Misses the brief', tone: 'danger' },
  'not-verified': { label: 'Not verified', tone: 'neutral' },
  failed: { label: 'Could not verify', tone: 'caution' },
};

/** The objective's unit in words: "currency" is the workspace's currency code. */
export function objectiveUnitText(unit: string | null | undefined, currency: string): string {
  if (!unit) return '';
  return unit === 'currency' ? currency : unit;
}

/** A binding or blocking constraint's kind in a word or two (the full label goes in a tooltip and the tables). */
export const CONSTRAINT_WORDS: Record<string, string> = {
  'heat-budget': 'heat budget',
  solubility: 'solubility',
  'water-for-reaction': 'water for reaction',
  'total-mass': 'pack mass',
  'unit-cost': 'unit cost',
  gas: 'gas',
  'surface-temperature': 'surface temperature',
  'oxygen-supply': 'oxygen supply',
  'concentration-cap': 'concentration cap',
  'additive-ratio': 'additive ratio',
  'partner-stoichiometry': 'reaction partner',
};

/**
 * The one way a candidate is named on every screen: "C-14", with its place in its run where
 * that matters ("C-14 · rank 1 in run 2"). The number is the candidate's own id (one base,
 * counted from 1), never its rank.
 */
export function candidateRef(c: { id: number }): string {
  return `C-${c.id}`;
}

export function candidateTitle(c: { id: number; rank: number; runId: number }): string {
  return `${candidateRef(c)} · rank ${c.rank} in run ${c.runId}`;
}

/** What the ranked table's hazard column reads: the label's signal word and pictogram codes, and the flags a reviewer looks for first. */
export function hazardSummary(c: Pick<Candidate, 'hazards' | 'hazardScore'>): { signalWord: string | null; pictograms: string[]; flags: string[]; score: number } {
  const h = c.hazards;
  if (!h) return { signalWord: null, pictograms: [], flags: [], score: c.hazardScore };
  const flags: string[] = [];
  if (h.notes.some((n) => n.ruleId.startsWith('precursor.'))) flags.push('explosives precursor');
  if (h.classification.some((k) => k.hazardClass.startsWith('ox-'))) flags.push('oxidiser');
  if (h.notes.some((n) => n.ruleId.startsWith('incompat.'))) flags.push('incompatible pair');
  if (h.notes.some((n) => n.ruleId.startsWith('skin.') && (n.severity === 'warning' || n.severity === 'blocker'))) flags.push('skin temperature');
  return { signalWord: h.label.signalWord, pictograms: h.label.pictograms, flags, score: h.score };
}

/** A simulated miss in a few words: "misses the brief: holds 17.6 of 20 min". */
export function missSummary(c: Pick<Candidate, 'verification'>, holdMin: number): string {
  const v = c.verification;
  if (v.status === 'failed') return 'could not be simulated';
  if (v.minutesInBand !== null && v.minutesInBand < holdMin - 0.05) return `misses the brief: holds ${v.minutesInBand.toFixed(1)} of ${holdMin} min`;
  return `misses the brief: ${v.reasons[0] ?? 'see the reasons'}`;
}
