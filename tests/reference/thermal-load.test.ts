import { describe, expect, it } from 'vitest';
import { defaultChemistryLibrary } from '@shared/chemistry';
import { evaluate } from '@shared/evaluation/evaluate';
import { verifyComposition } from '@shared/evaluation/verify';
import { LOAD_CONTACT_W_PER_M2K, lumpedLoad } from '@shared/evaluation/load';
import { briefSchema } from '@shared/schemas/briefs';
import { WATER_CP_J_PER_GK } from '@shared/thermal/constants';

const lib = defaultChemistryLibrary();
const water = (massG: number) => ({ id: 'water', name: 'water', massG, role: 'solvent', process: null });

describe('the load: a second lumped node heated or cooled by the pack', () => {
  it('two lumps exchanging through UA relax as the two-body solution', () => {
    // Two lumped capacitances C_p, C_l coupled by UA, insulated from the surroundings:
    // T_p − T_l = (T_p0 − T_l0)·exp(−UA·(1/C_p + 1/C_l)·t), and both tend to the
    // capacity-weighted mean (lumped-capacitance method, Incropera & DeWitt, Fundamentals of
    // Heat and Mass Transfer, §5.1–5.2, applied to two bodies).
    const packG = 300;
    const cp = packG * WATER_CP_J_PER_GK;
    const cl = 500 * 3.6;
    const ua = 2;
    const ev = evaluate({
      lines: [water(packG)],
      conditions: {
        initialTempC: 80,
        ambientC: 20,
        exchange: { uaWPerK: 0 },
        packHeatCapacityJPerK: 0,
        horizonMin: 60,
        load: { kind: 'food-drink', massG: 500, cpJPerGK: 3.6, initialTempC: 10, uaToPackWPerK: ua },
      },
      chemistry: lib,
      options: { rtol: 1e-8 },
    });
    const load = ev.figures.load!;
    const mean = (cp * 80 + cl * 10) / (cp + cl);
    const rate = ua * (1 / cp + 1 / cl);
    ev.profile.curve.forEach((pt, k) => {
      const gap = 70 * Math.exp(-rate * pt.tMin * 60);
      // Tolerance 2 mK: integration error only (rtol 1e-8 over 70 K).
      expect(Math.abs(pt.tempC - (mean + (gap * cl) / (cp + cl)))).toBeLessThan(2e-3);
      expect(Math.abs(load.curve[k]!.tempC - (mean - (gap * cp) / (cp + cl)))).toBeLessThan(2e-3);
    });
    // The heat the load received is its sensible heat; the pack's balance counts it as heat that left.
    expect(load.heatFromPackJ).toBeCloseTo(cl * (load.endTempC - 10), 0);
    expect(ev.profile.energy.relativeBalanceError).toBeLessThan(1e-6);
  });

  it('a heater held at the boiling point raises an 8-ounce entrée by 100 °F in about 12 minutes', () => {
    // Reference (from memory, a procurement figure for military flameless ration heaters):
    // raise an 8-ounce (227 g) entrée by 100 °F (55.6 K) in about 12 minutes.
    // The heater's water boils at 1 atm while it reacts, so the pad is held near 100 °C: here a
    // large water bath at 100 °C stands in for it (the heater chemistry is not what is checked).
    // Entrée: 227 g at 3.6 J/(g·K) (a wet meal, from memory), from 21 °C; one face of a
    // 15 cm × 20 cm pouch (0.03 m²) against the pad at the food-contact conductance of
    // evaluation/load.ts (an assumption). Tolerance ±40 % (7–17 min): the reference is a
    // remembered "about", and the contact conductance is assumed, not measured.
    const ev = evaluate({
      lines: [water(20000)],
      conditions: {
        initialTempC: 100,
        ambientC: 21,
        exchange: { uaWPerK: 0 },
        packHeatCapacityJPerK: 0,
        horizonMin: 30,
        targetTempC: 21 + 55.6,
        load: { kind: 'food-drink', massG: 227, cpJPerGK: 3.6, initialTempC: 21, contactAreaM2: 0.03 },
      },
      chemistry: lib,
    });
    expect(LOAD_CONTACT_W_PER_M2K['food-drink'] * 0.03).toBeCloseTo(1.5, 9);
    const t = ev.figures.timeToTargetMin!;
    expect(t).toBeGreaterThan(12 * 0.6);
    expect(t).toBeLessThan(12 * 1.4);
    // Judged on the load: the pad itself stays near 100 °C.
    expect(ev.figures.minTempC).toBeGreaterThan(99);
  });

  it('the brief’s target and hold apply to the load; an old brief without a load still parses', () => {
    const meal = briefSchema.parse({
      name: 'Meal heater',
      packType: 'warm',
      ambientC: 21,
      targetTempC: 60,
      maxSurfaceTempC: null,
      reachWithinMin: 15,
      holdMin: 10,
      uaWPerK: 0.3,
      maxGasL: 10,
      load: { kind: 'food-drink', massG: 227, cpJPerGK: 3.6, contactAreaM2: 0.03 },
    });
    const noLoad = briefSchema.parse({ name: 'old brief' });
    expect(noLoad.load).toBeNull();
    const mg = {
      id: 'mg',
      name: 'Magnesium powder',
      massG: 8,
      role: 'active',
      process: { kind: 'reaction' as const, reactants: [{ key: 'Mg(cr)', coef: 1 }, { key: 'H2O(l)', coef: 2 }], products: [{ key: 'Mg(OH)2(cr)', coef: 1 }, { key: 'H2(g)', coef: 1 }], ingredientKey: 'Mg(cr)' },
    };
    const withLoad = verifyComposition(lib, meal, [mg, water(45)]);
    const withoutLoad = verifyComposition(lib, { ...meal, load: null }, [mg, water(45)]);
    const ev = withLoad.evaluation!;
    expect(ev.figures.load).not.toBeNull();
    // The load lags the pack: it reaches 60 °C later than the heater itself does.
    expect(withLoad.timeToTargetMin!).toBeGreaterThan(withoutLoad.timeToTargetMin!);
    expect(withLoad.timeToTargetMin).toBe(ev.profile.load!.timeToTargetMin);
    // Heat into the load closes the pack's energy balance.
    expect(ev.profile.energy.relativeBalanceError).toBeLessThan(1e-5);
    // A 2 kg load cannot be brought to 60 °C by 8 g of magnesium in 15 min: the reason names the load.
    const heavy = verifyComposition(lib, { ...meal, load: { ...meal.load!, massG: 2000 } }, [mg, water(45)]);
    expect(heavy.status).toBe('missed');
    expect(heavy.reasons.join(' ')).toMatch(/^the load /);
  });

  it('a load needs exactly one coupling to the pack', () => {
    expect(() => lumpedLoad({ kind: 'cold-chain-box', massG: 100, cpJPerGK: 4 }, 20)).toThrow(/uaToPackWPerK or contactAreaM2/);
    expect(briefSchema.safeParse({ name: 'x', load: { kind: 'food-drink', massG: 100, cpJPerGK: 3, uaToPackWPerK: 1, contactAreaM2: 0.01 } }).success).toBe(false);
  });
});
