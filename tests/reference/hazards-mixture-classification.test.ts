import { describe, expect, it } from 'vitest';
import { ateCategory, ateMix, classifyMixture, labelElements, type MixtureComponent } from '@shared/hazards/mixture-classification';
import { hStatementText, pStatementsFor } from '@shared/hazards/h-statements';
import { ingredientHazardDataSchema, type GhsClassification } from '@shared/schemas/hazards';

// Worked examples: UN Sub-Committee of Experts on the GHS, document ST/SG/AC.10/C.4/2008/23,
// Annex 2 ("examples of the application of the acute toxicity mixture criteria"), as read in a
// stored copy of the examples. Constructed cases below pin the arithmetic of the GHS Rev. 9
// Tables 3.2.3 and 3.3.3 (CLP Annex I Tables 3.2.3 and 3.3.3) at and around each cut-off.

const data = (classifications: GhsClassification[], extra: Record<string, unknown> = {}) => ingredientHazardDataSchema.parse({ classifications, source: 'constructed test case', ...extra });
const c = (hazardClass: string, category: string, ...h: string[]): GhsClassification => ({ hazardClass, category, hStatements: h });
const filler = (massG: number): MixtureComponent => ({ name: 'filler', massG, hazardData: null });
const one = (pct: number, classes: GhsClassification[]): MixtureComponent[] => [{ name: 'x', massG: pct, hazardData: data(classes) }, filler(100 - pct)];
const classesOf = (m: MixtureComponent[], opts = {}) => classifyMixture(m, opts).classifications.map((e) => `${e.hazardClass} ${e.category}`);

describe('ATEmix by additivity (GHS Rev. 9 3.1.3.6.1)', () => {
  it('100/ATEmix = Σ Ci/ATEi: 16 % at 1600, 4 % at 200, 80 % at 3450 mg/kg → 1880 mg/kg, category 4 (ST/SG/AC.10/C.4/2008/23 Annex 2, example on 3.1.3.6.1; category 5 in use)', () => {
    const r = ateMix('oral', [
      { concentrationPct: 16, ate: 1600 },
      { concentrationPct: 4, ate: 200 },
      { concentrationPct: 80, ate: 3450 },
    ], true);
    // The example rounds to 1880; tolerance 1 mg/kg for that rounding.
    expect(r.ateMix).toBeCloseTo(1880, -1);
    expect(Math.abs(r.ateMix - 1880)).toBeLessThan(1);
    expect(r.category).toBe(4);
  });

  it('ingredients in no acute toxicity category are ignored: 4 % at 1737 mg/kg alone → 43,425 mg/kg, not classified (ST/SG/AC.10/C.4/2008/23 Annex 2, example 3)', () => {
    // Ingredients at > 5000 mg/kg and 5400 mg/kg fall in no category and are left out, as in the example.
    const r = ateMix('oral', [{ concentrationPct: 4, ate: 1737 }, { concentrationPct: 5, ate: null }, { concentrationPct: 5, ate: null }, { concentrationPct: 86, ate: null }], true);
    expect(r.ateMix).toBeCloseTo(43425, 0);
    expect(r.category).toBeNull();
  });

  it('oral 26 % at 2737, 23 % at 4500, 40 % at 400 mg/kg → 873 mg/kg, category 4 (ST/SG/AC.10/C.4/2008/23 Annex 2, example on 3.1.3.6.1 and 3.1.3.6.2.3)', () => {
    const r = ateMix('oral', [
      { concentrationPct: 26, ate: 2737 },
      { concentrationPct: 23, ate: 4500 },
      { concentrationPct: 40, ate: 400 },
      { concentrationPct: 11, ate: null },
    ], true);
    // The example prints 873 (rounded); ±1 mg/kg.
    expect(Math.abs(r.ateMix - 873)).toBeLessThan(1);
    expect(r.category).toBe(4);
  });

  it('unknown share > 10 %: (100 − ΣCunknown)/ATEmix = Σ Ci/ATEi; vapour 26 % at 11, 23 % at 19, 40 % at 4 mg/L, 11 % unknown → 6.6 mg/L, category 3 (same example, 3.1.3.6.2.3)', () => {
    const r = ateMix('inhalation-vapour', [
      { concentrationPct: 26, ate: 11 },
      { concentrationPct: 23, ate: 19 },
      { concentrationPct: 40, ate: 4 },
      { concentrationPct: 11, ate: null, unknown: true },
    ]);
    expect(r.corrected).toBe(true);
    expect(r.unknownPct).toBeCloseTo(11, 12);
    // The example prints 6.6 mg/L; ±0.05 for its rounding.
    expect(Math.abs(r.ateMix - 6.6)).toBeLessThan(0.05);
    expect(r.category).toBe(3);
  });

  it('an unknown share of exactly 10 % keeps the plain formula (corrected only above 10 %, GHS 3.1.3.6.2.3; constructed)', () => {
    const r = ateMix('oral', [{ concentrationPct: 50, ate: 500 }, { concentrationPct: 10, ate: null, unknown: true }]);
    expect(r.corrected).toBe(false);
    expect(r.ateMix).toBeCloseTo(1000, 9); // 100 / (50/500)
  });

  it('ingredients below 1 % are not relevant (GHS 3.1.3.3(a); constructed)', () => {
    expect(ateMix('oral', [{ concentrationPct: 0.99, ate: 1 }]).ateMix).toBe(Number.POSITIVE_INFINITY);
    expect(ateMix('oral', [{ concentrationPct: 1, ate: 1 }]).ateMix).toBeCloseTo(100, 9);
  });

  it('oral categories: ≤ 5, ≤ 50, ≤ 300, ≤ 2000 mg/kg; ≤ 5000 only with category 5 (GHS Table 3.1.1, from memory)', () => {
    expect([5, 5.01, 50, 50.1, 300, 300.1, 2000, 2000.1].map((v) => ateCategory('oral', v))).toEqual([1, 2, 2, 3, 3, 4, 4, null]);
    expect(ateCategory('oral', 5000, true)).toBe(5);
    expect(ateCategory('oral', 5000.1, true)).toBeNull();
  });

  it('a classified ingredient without an LD50 uses the converted point estimate (GHS Table 3.1.2: category 3 oral → 100 mg/kg, from memory): 20 % → ATEmix 500 mg/kg, category 4', () => {
    const r = classifyMixture(one(20, [c('acute-tox-oral', '3', 'H301')]));
    expect(r.ate.oral?.ateMix).toBeCloseTo(500, 9);
    expect(r.classifications.find((e) => e.hazardClass === 'acute-tox-oral')?.category).toBe('4');
  });

  it('the mixture states the share of unknown acute toxicity when ≥ 1 % (GHS 3.1.3.6.2.2)', () => {
    const r = classifyMixture([{ name: 'tox', massG: 30, hazardData: data([c('acute-tox-oral', '4', 'H302')], { acuteToxicityEstimates: { oralMgPerKg: 500 } }) }, { name: 'unk', massG: 20, hazardData: null, acuteToxicityUnknown: true }, filler(50)]);
    expect(r.ate.oral?.corrected).toBe(true);
    expect(r.ate.oral?.ateMix).toBeCloseTo(80 / (30 / 500), 9);
    expect(r.supplementalStatements[0]).toMatch(/^20 % of the mixture consists of ingredient\(s\) of unknown acute toxicity/);
  });
});

describe('skin corrosion / irritation cut-offs (GHS Rev. 9 Table 3.2.3; CLP Annex I Table 3.2.3)', () => {
  const corr = [c('skin-corr', '1B', 'H314')];
  const irrit = [c('skin-irrit', '2', 'H315')];
  it('Σ skin corr 1 ≥ 5 % → Skin Corr. 1; 4.99 % → Skin Irrit. 2', () => {
    expect(classesOf(one(5, corr))).toContain('skin-corr 1B');
    expect(classesOf(one(4.99, corr))).toContain('skin-irrit 2');
    expect(classesOf(one(4.99, corr))).not.toContain('skin-corr 1B');
  });
  it('1 % ≤ Σ skin corr 1 < 5 % → Skin Irrit. 2; 0.99 % is not relevant', () => {
    expect(classesOf(one(1, corr))).toContain('skin-irrit 2');
    expect(classesOf(one(0.99, corr)).filter((x) => x.startsWith('skin'))).toEqual([]);
  });
  it('Σ skin irrit 2 ≥ 10 % → Skin Irrit. 2; 9.99 % → not classified', () => {
    expect(classesOf(one(10, irrit))).toEqual(['skin-irrit 2']);
    expect(classesOf(one(9.99, irrit))).toEqual([]);
  });
  it('10 × Σ skin corr 1 + Σ skin irrit 2 ≥ 10 % weighs only relevant ingredients (≥ 1 %, GHS 3.2.3.3.1): 0.9 % corr + 1 % irrit → not classified; 1 % corr + 1 % irrit → Skin Irrit. 2 (and Eye Irrit. 2, the corr ingredient counting for the eye)', () => {
    const m = (corrPct: number, irritPct: number): MixtureComponent[] => [
      { name: 'corr', massG: corrPct, hazardData: data(corr) },
      { name: 'irr', massG: irritPct, hazardData: data(irrit) },
      filler(100 - corrPct - irritPct),
    ];
    expect(classesOf(m(0.9, 1))).toEqual([]);
    expect(classesOf(m(1, 1))).toEqual(['skin-irrit 2', 'eye-irrit 2']);
    // 0.9 % corr + 9.5 % irrit: 10 × 0.9 + 9.5 = 18.5 % if the corr ingredient were counted; it is not relevant, and 9.5 % < 10 %.
    expect(classesOf(m(0.9, 9.5))).toEqual([]);
  });
  it('the ×10 weighting of category 1 decides when a sub-1 % corrosive is relevant: 10 × 0.5 + 5 = 10 % → Skin Irrit. 2; 10 × 0.5 + 4.9 = 9.9 % → not classified', () => {
    const m = (irritPct: number): MixtureComponent[] => [{ name: 'corr', massG: 0.5, hazardData: data(corr) }, { name: 'irr', massG: irritPct, hazardData: data(irrit) }, filler(99.5 - irritPct)];
    const at = classifyMixture(m(5), { alsoRelevant: ['corr'] }).classifications.find((e) => e.hazardClass === 'skin-irrit');
    expect(at?.rule).toMatch(/^10 × Σ skin corr 1 \+ Σ skin irrit 2 = 10 % ≥ 10 %/);
    expect(classesOf(m(4.9), { alsoRelevant: ['corr'] }).filter((x) => x.startsWith('skin'))).toEqual([]);
  });
  it('CLP sub-category: Σ1A ≥ 5 % → 1A; 1A 3 % + 1B 3 % → 1B; 1C only → 1C', () => {
    const m = (parts: [string, number][]): MixtureComponent[] => [...parts.map(([cat, pct], i) => ({ name: `c${i}`, massG: pct, hazardData: data([c('skin-corr', cat, 'H314')]) })), filler(100 - parts.reduce((a, p) => a + p[1], 0))];
    expect(classesOf(m([['1A', 5]]))).toContain('skin-corr 1A');
    expect(classesOf(m([['1A', 3], ['1B', 3]]))).toContain('skin-corr 1B');
    expect(classesOf(m([['1C', 6]]))).toContain('skin-corr 1C');
  });
});

describe('serious eye damage / eye irritation cut-offs (GHS Rev. 9 Table 3.3.3; CLP Annex I Table 3.3.3)', () => {
  const dam = [c('eye-dam', '1', 'H318')];
  const irr = [c('eye-irrit', '2', 'H319')];
  it('Σ(skin corr 1 + eye dam 1) ≥ 3 % → Eye Dam. 1; 2.99 % → Eye Irrit. 2', () => {
    expect(classesOf(one(3, dam))).toEqual(['eye-dam 1']);
    expect(classesOf(one(2.99, dam))).toEqual(['eye-irrit 2']);
  });
  it('a skin corr 1 ingredient counts for the eye: 3 % Skin Corr. 1B → Skin Irrit. 2 and Eye Dam. 1', () => {
    expect(classesOf(one(3, [c('skin-corr', '1B', 'H314')]))).toEqual(['skin-irrit 2', 'eye-dam 1']);
  });
  it('Σ eye irrit 2 ≥ 10 % → Eye Irrit. 2; 9.99 % → not classified', () => {
    expect(classesOf(one(10, irr))).toEqual(['eye-irrit 2']);
    expect(classesOf(one(9.99, irr))).toEqual([]);
  });
  it('×10 weighting for the eye: a relevant 0.5 % eye dam 1 + 5 % eye irrit 2 = 10 % → Eye Irrit. 2; + 4.9 % → not classified', () => {
    const m = (irrPct: number): MixtureComponent[] => [{ name: 'dam', massG: 0.5, hazardData: data(dam) }, { name: 'irr', massG: irrPct, hazardData: data(irr) }, filler(99.5 - irrPct)];
    expect(classifyMixture(m(5), { alsoRelevant: ['dam'] }).classifications[0]?.rule).toMatch(/^10 × Σ\(skin corr 1 \+ eye dam 1\) \+ Σ eye irrit 2 = 10 % ≥ 10 %/);
    expect(classesOf(m(4.9), { alsoRelevant: ['dam'] })).toEqual([]);
  });
  it('×10 weighting of category 1: 0.9 % eye dam 1 is below 1 % (not relevant); 1 % eye dam 1 → Eye Irrit. 2; 5 % eye irrit 2 + the ×10 sum of relevant category 1', () => {
    const m = (damPct: number, irrPct: number): MixtureComponent[] => [
      { name: 'dam', massG: damPct, hazardData: data(dam) },
      { name: 'irr', massG: irrPct, hazardData: data(irr) },
      filler(100 - damPct - irrPct),
    ];
    expect(classesOf(m(0.9, 9))).toEqual([]); // 0.9 % not relevant, 9 % < 10 %
    expect(classesOf(m(1, 0))).toEqual(['eye-irrit 2']);
    const r = classifyMixture(m(1, 5)).classifications[0]!;
    // The first matching row decides (1 % ≤ Σ cat 1 < 3 %); the ×10 row would give 10 × 1 + 5 = 15 % ≥ 10 % too.
    expect(r.category).toBe('2');
  });
});

describe('the pH rule (GHS 3.2.3.1.2 / 3.3.3.1.2; CLP 3.2.3.1.2 / 3.3.3.1.2)', () => {
  const m = one(20, [c('eye-irrit', '2', 'H319')]);
  it('pH ≥ 11.5 → Skin Corr. 1 and Eye Dam. 1; 11.49 → by the cut-offs only', () => {
    expect(classesOf(m, { mixturePH: 11.5 })).toEqual(['skin-corr 1', 'eye-dam 1']);
    expect(classesOf(m, { mixturePH: 11.49 })).toEqual(['eye-irrit 2']);
  });
  it('pH ≤ 2 → corrosive; 2.01 → not by pH', () => {
    expect(classesOf(m, { mixturePH: 2 })).toEqual(['skin-corr 1', 'eye-dam 1']);
    expect(classesOf(m, { mixturePH: 2.01 })).toEqual(['eye-irrit 2']);
  });
  it('buffering data to the contrary switch the pH rule off', () => {
    expect(classesOf(m, { mixturePH: 13, bufferingShowsNotCorrosive: true })).toEqual(['eye-irrit 2']);
  });
});

describe('simple cut-offs and carried-over classes', () => {
  it('STOT SE 3 at Σ ≥ 20 % of the same effect (CLP 3.8.3.4.5); 19.9 % → not classified', () => {
    const stot = [c('stot-se', '3', 'H335')];
    expect(classesOf(one(20, stot))).toEqual(['stot-se 3']);
    expect(classesOf(one(19.9, stot))).toEqual([]);
  });
  it('oxidising solids are carried over from an ingredient ≥ 1 %, not computed (GHS ch. 2.14 needs test O.1/O.3)', () => {
    const r = classifyMixture(one(1, [c('ox-sol', '3', 'H272')]));
    expect(r.classifications[0]?.rule).toMatch(/^carried over/);
    expect(r.notes.map((n) => n.ruleId)).toEqual(['classification.carried.ox-sol']);
    expect(classesOf(one(0.99, [c('ox-sol', '3', 'H272')]))).toEqual([]);
  });
});

describe('label elements (CLP Art. 20, 26, 27; GHS 1.4.10.5.3)', () => {
  it('GHS06 removes GHS07; signal word Danger when any class needs it', () => {
    const l = labelElements([c('acute-tox-oral', '3', 'H301'), c('eye-irrit', '2', 'H319')]);
    expect(l.pictograms).toEqual(['GHS06']);
    expect(l.signalWord).toBe('Danger');
    expect(l.hStatements).toEqual(['H301', 'H319']);
  });
  it('GHS05 removes GHS07 used for skin/eye irritation only, not GHS07 for acute toxicity 4', () => {
    expect(labelElements([c('eye-dam', '1', 'H318'), c('skin-irrit', '2', 'H315')]).pictograms).toEqual(['GHS05']);
    expect(labelElements([c('eye-dam', '1', 'H318'), c('acute-tox-oral', '4', 'H302')]).pictograms).toEqual(['GHS05', 'GHS07']);
  });
  it('H318 and H319 are not printed beside H314; statements are de-duplicated and ordered', () => {
    const l = labelElements([c('skin-corr', '1A', 'H314'), c('eye-dam', '1', 'H318'), c('eye-irrit', '2', 'H319'), c('acute-tox-oral', '4', 'H302'), c('acute-tox-oral', '4', 'H302')]);
    expect(l.hStatements).toEqual(['H302', 'H314']);
  });
  it('P-statements that follow directly: Eye Irrit. 2 → P264, P280, P305+P351+P338, P337+P313 (GHS Annex 3, from memory); P102 for a consumer product', () => {
    expect(pStatementsFor([c('eye-irrit', '2', 'H319')])).toEqual(['P264', 'P280', 'P305+P351+P338', 'P337+P313']);
    expect(labelElements([c('eye-irrit', '2', 'H319')]).pStatements[0]).toBe('P102');
    expect(labelElements([c('eye-irrit', '2', 'H319')], { consumerProduct: false }).pStatements).not.toContain('P102');
    expect(labelElements([]).pStatements).toEqual([]);
  });
  it('H-statement texts by code (UN GHS Annex 3, from memory)', () => {
    expect(hStatementText('H272')).toBe('May intensify fire; oxidizer');
    expect(hStatementText('H314')).toBe('Causes severe skin burns and eye damage');
    expect(() => hStatementText('H999')).toThrow(/found "H999"/);
  });
});
