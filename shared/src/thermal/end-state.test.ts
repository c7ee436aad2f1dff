import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { COLD_SALT, constructedPort, SPARING_SALT } from './__fixtures__/constructed-port';
import { defaultChemistryPort } from './chemistry-adapter';
import { solveEndState } from './end-state';
import type { ThermalComponent } from './pack-model';

const water = (massG: number): ThermalComponent => ({ key: 'water', massG, process: { kind: 'inert', role: 'water' } });
const salt = (solidKey: string, massG: number): ThermalComponent => ({ key: solidKey, massG, process: { kind: 'dissolution', solidKey } });
const port = constructedPort({ 'COLD(cr)': COLD_SALT, 'SPARING(cr)': SPARING_SALT });
const real = defaultChemistryPort();

function inventoryTotal(r: ReturnType<typeof solveEndState>): number {
  const m = r.massInventory;
  return m.solutionG + m.undissolvedG + m.iceG + m.reactionSolidsG + m.meltG + m.metalAndOxideG + m.inertG - m.gainedG + m.lostAsGasG;
}

describe('solveEndState', () => {
  it('an adiabatic mixture of water alone ends at its initial temperature', () => {
    const r = solveEndState(port, { initialTempC: 21, components: [water(100)] });
    expect(r.endTempC).toBe(21);
    expect(r.energy.heatReleasedJ).toBe(0);
  });

  it('closes the enthalpy balance: released = stored + lost', () => {
    const r = solveEndState(port, { initialTempC: 25, heatLostJ: 500, components: [water(100), salt('COLD(cr)', 40)] });
    expect(Math.abs(r.energy.balanceErrorJ)).toBeLessThan(1e-6 * Math.abs(r.energy.heatReleasedJ));
    expect(r.energy.heatLostJ).toBe(500);
  });

  it('a heat loss makes a cold pack end colder than the adiabatic one', () => {
    const a = solveEndState(port, { initialTempC: 25, components: [water(100), salt('COLD(cr)', 30)] });
    const b = solveEndState(port, { initialTempC: 25, heatLostJ: 1000, components: [water(100), salt('COLD(cr)', 30)] });
    expect(b.endTempC).toBeLessThan(a.endTempC);
  });

  it('dissolved amount at a solubility-limited end equals the solubility at the end temperature', () => {
    const r = solveEndState(port, { initialTempC: 25, components: [water(100), salt('SPARING(cr)', 80)] });
    expect(r.solutes[0]!.limitedBy).toBe('solubility');
    const dissolvedG = r.solutes[0]!.dissolvedFraction * 80;
    const expected = SPARING_SALT.solubilityAt0_gPer100g + SPARING_SALT.solubilitySlope_gPer100gK * r.endTempC;
    expect(dissolvedG).toBeCloseTo(expected, 6);
  });

  it('property: with cold salts from 0–60 °C the end is finite, no warmer than the start, balance closed and mass conserved', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 300, noNaN: true }),
        fc.double({ min: 0, max: 150, noNaN: true }),
        fc.double({ min: 1, max: 300, noNaN: true }),
        fc.double({ min: 0, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 500, noNaN: true }),
        (cold, sparing, waterG, t0, packC) => {
          const r = solveEndState(port, {
            initialTempC: t0,
            packHeatCapacityJPerK: packC,
            components: [water(waterG), salt('COLD(cr)', cold), salt('SPARING(cr)', sparing)],
          });
          expect(Number.isFinite(r.endTempC)).toBe(true);
          expect(r.endTempC).toBeLessThanOrEqual(t0 + 1e-9);
          expect(r.energy.relativeBalanceError).toBeLessThan(1e-6);
          expect(inventoryTotal(r)).toBeCloseTo(cold + sparing + waterG, 6);
          for (const s of r.solutes) expect(s.dissolvedFraction).toBeGreaterThanOrEqual(0);
          expect(r.iceG).toBeGreaterThanOrEqual(0);
        },
      ),
      { numRuns: 300 },
    );
  });

  it('property: adding salt past saturation never makes the end colder', () => {
    fc.assert(
      fc.property(fc.double({ min: 60, max: 300, noNaN: true }), fc.double({ min: 0.1, max: 100, noNaN: true }), (base, extra) => {
        const a = solveEndState(port, { initialTempC: 25, components: [water(100), salt('SPARING(cr)', base)] });
        const b = solveEndState(port, { initialTempC: 25, components: [water(100), salt('SPARING(cr)', base + extra)] });
        expect(a.solutes[0]!.limitedBy).toBe('solubility');
        expect(b.endTempC).toBeGreaterThanOrEqual(a.endTempC - 1e-9);
      }),
      { numRuns: 100 },
    );
  });

  it('property: a pack never ends below the eutectic of its solute', () => {
    fc.assert(
      fc.property(fc.double({ min: 5, max: 300, noNaN: true }), fc.double({ min: 10, max: 200, noNaN: true }), fc.double({ min: -10, max: 30, noNaN: true }), (s, w, t0) => {
        const r = solveEndState(port, { initialTempC: t0, components: [water(w), salt('COLD(cr)', s)] });
        expect(r.endTempC).toBeGreaterThanOrEqual(COLD_SALT.eutectic!.tempC - 1e-6);
      }),
      { numRuns: 200 },
    );
  });

  it('heat lost from water at 0 °C freezes part of it on the 0 °C plateau (latent heat of fusion 333.6 J/g, CRC)', () => {
    const r = solveEndState(port, { initialTempC: 0, heatLostJ: 3336, components: [water(100)] });
    expect(r.endTempC).toBeCloseTo(0, 6);
    expect(r.onPlateau).toBe(true);
    expect(r.iceG).toBeCloseTo(10, 3);
  });

  it('a supercooled melt crystallises to its melting-point plateau when its latent heat exceeds the sensible heat to get there', () => {
    const r = solveEndState(port, { initialTempC: 20, components: [{ key: 'sat', massG: 100, process: { kind: 'crystallisation' } }] });
    expect(r.endTempC).toBeCloseTo(58, 6);
    expect(r.onPlateau).toBe(true);
  });

  it('the real chemistry: 40 g NH4NO3 in 100 g water ends between 0 and 5 °C and fully dissolved', () => {
    const r = solveEndState(real, { initialTempC: 25, components: [water(100), salt('NH4NO3(cr)', 40)] });
    expect(r.endTempC).toBeGreaterThan(0);
    expect(r.endTempC).toBeLessThan(5);
    expect(r.solutes[0]!.dissolvedFraction).toBe(1);
  });

  it('supercooled water below 0 °C freezes back up to the 0 °C plateau', () => {
    const r = solveEndState(port, { initialTempC: -2, components: [water(100)] });
    expect(r.endTempC).toBeCloseTo(0, 6);
    expect(r.iceG).toBeGreaterThan(0);
  });

  it('rejects an initial temperature outside the model range, naming the field', () => {
    expect(() => solveEndState(port, { initialTempC: Number.NaN, components: [water(1)] })).toThrow(/initialTempC/);
  });
});
