import { describe, expect, it } from 'vitest';
import { defaultChemistryPort } from '@shared/thermal/chemistry-adapter';
import { contactUA } from '@shared/thermal/contact';
import type { ThermalComponent } from '@shared/thermal/pack-model';
import { simulateTimeProfile } from '@shared/thermal/time-profile';

/**
 * Air-activated warmers: the film's O2 permeance, the film's area and the pouch's size are
 * separate inputs. The figures for a typical warmer are common practice, no source.
 */

const port = defaultChemistryPort();
const warmer = (filmAreaM2?: number): ThermalComponent[] => [
  { key: 'iron', massG: 20, process: { kind: 'air-oxidation', ...(filmAreaM2 !== undefined ? { filmAreaM2 } : {}) } },
  { key: 'water', massG: 10, process: { kind: 'inert', role: 'water' } },
  { key: 'carbon', massG: 5, process: { kind: 'inert', role: 'additive' } },
  { key: 'vermiculite', massG: 5, process: { kind: 'inert', role: 'additive' } },
];

function run(components: ThermalComponent[], pouchAreaM2: number) {
  const c = contactUA({ case: 'still-air', geometry: { areaM2: pouchAreaM2 } }, 20, 40);
  return simulateTimeProfile(port, {
    components,
    initialTempC: 20,
    envTempC: 20,
    uaWPerK: c.uaWPerK,
    packAreaM2: c.areaM2,
    holdMin: 720,
    targetBand: { minC: 40, maxC: 70 },
  });
}

describe('air-activated warmers', () => {
  it('a typical 40 g warmer (13 × 9.5 cm pouch) in 20 °C still air reaches 50–60 °C and stays above 40 °C for hours', () => {
    // Common practice, no source: disposable hand warmers run at about 50–60 °C for several hours.
    const r = run(warmer(), 2 * 0.13 * 0.095);
    expect(r.maxTempC).toBeGreaterThan(50);
    expect(r.maxTempC).toBeLessThan(60);
    expect(r.minutesInBand!).toBeGreaterThan(3 * 60);
    expect(r.warnings.map((w) => w.code)).toContain('thermal.film-area-assumed');
    expect(r.energy.relativeBalanceError).toBeLessThan(5e-3);
  });

  it('the film area and the pouch size act separately: more film runs hotter and shorter, a bigger pouch with the same film runs cooler', () => {
    const pouch = 2 * 0.13 * 0.095;
    const base = run(warmer(0.0124), pouch);
    const moreFilm = run(warmer(0.0248), pouch);
    const biggerPouch = run(warmer(0.0124), 2 * pouch);
    expect(moreFilm.maxTempC).toBeGreaterThan(base.maxTempC + 10);
    expect(moreFilm.minutesInBand!).toBeLessThan(base.minutesInBand!);
    expect(biggerPouch.maxTempC).toBeLessThan(base.maxTempC - 10);
    // Steady state with supply-limited O2: T − T_air = q/UA, so twice the film doubles the excess (within 10 %, radiation is not linear).
    const excess = (r: { maxTempC: number }) => r.maxTempC - 20;
    expect(excess(moreFilm) / excess(base)).toBeGreaterThan(1.8);
    expect(excess(moreFilm) / excess(base)).toBeLessThan(2.2);
  });
});
