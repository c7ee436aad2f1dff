/**
 * Which solid leaves an aqueous solution, by temperature: the stable solid phase of each salt
 * in equilibrium with its saturated solution. The solubility table the product reads (CRC
 * Handbook, "Aqueous Solubility of Inorganic Compounds at Various Temperatures") gives, at each
 * temperature, the solubility of the phase stable there, expressed as anhydrous mass; so the
 * curve and the phase below belong together.
 *
 * Transition temperatures (°C) are the usual handbook figures (CRC Handbook notes on the solid
 * phases; Seidell, Solubilities of Inorganic and Metal Organic Compounds, 1940), from memory.
 * A phase not in the species data (MgSO4·6H2O above 48 °C, CaCl2·4H2O 29.8–45.3 °C,
 * Na2CO3·7H2O and ·H2O above 32 °C, the lower hydrates of Na2S2O3) is stood in for by the next
 * listed phase, with a warning when it is used (`gap`).
 */

export interface SolidPhase {
  /** Species key of the solid. */
  key: string;
  /** Mol of crystal water per formula unit. */
  hydrateWater: number;
  /** Stable from the previous phase's upper limit up to this temperature, °C. */
  upToC: number;
  /** The phase stands in for one the species data lack, over this range (°C), or null. */
  gap: { fromC: number; toC: number; realPhase: string } | null;
}

export interface HydrateFamily {
  soluteKey: string;
  phases: SolidPhase[];
}

const phase = (key: string, hydrateWater: number, upToC: number, gap: SolidPhase['gap'] = null): SolidPhase => ({ key, hydrateWater, upToC, gap });

export const HYDRATE_FAMILIES: readonly HydrateFamily[] = [
  { soluteKey: 'MgSO4(cr)', phases: [phase('MgSO4·7H2O(cr)', 7, Infinity, { fromC: 48.1, toC: Infinity, realPhase: 'MgSO4·6H2O / MgSO4·H2O' })] },
  { soluteKey: 'Na2SO4(cr)', phases: [phase('Na2SO4·10H2O(cr)', 10, 32.38), phase('Na2SO4(cr)', 0, Infinity)] },
  {
    soluteKey: 'Na2CO3(cr)',
    phases: [phase('Na2CO3·10H2O(cr)', 10, 32.0), phase('Na2CO3(cr)', 0, Infinity, { fromC: 32.0, toC: 109, realPhase: 'Na2CO3·7H2O / Na2CO3·H2O' })],
  },
  {
    soluteKey: 'CaCl2(cr)',
    phases: [phase('CaCl2·6H2O(cr)', 6, 29.8), phase('CaCl2·2H2O(cr)', 2, Infinity, { fromC: 29.8, toC: 45.3, realPhase: 'CaCl2·4H2O' })],
  },
  {
    soluteKey: 'Na2S2O3(cr)',
    phases: [phase('Na2S2O3·5H2O(cr)', 5, 48.2), phase('Na2S2O3(cr)', 0, Infinity, { fromC: 48.2, toC: 70, realPhase: 'lower hydrates of Na2S2O3' })],
  },
  { soluteKey: 'CH3COONa(cr)', phases: [phase('CH3COONa·3H2O(cr)', 3, 58.0), phase('CH3COONa(cr)', 0, Infinity)] },
  { soluteKey: 'MgCl2(cr)', phases: [phase('MgCl2·6H2O(cr)', 6, Infinity)] },
  { soluteKey: 'BaCl2(cr)', phases: [phase('BaCl2·2H2O(cr)', 2, Infinity)] },
];

export function hydrateFamily(soluteKey: string): HydrateFamily | null {
  return HYDRATE_FAMILIES.find((f) => f.soluteKey === soluteKey) ?? null;
}

/** Index of the phase stable at `tempC` in a family. */
export function stablePhaseIndex(family: HydrateFamily, tempC: number): number {
  for (let k = 0; k < family.phases.length; k++) if (tempC < family.phases[k]!.upToC) return k;
  return family.phases.length - 1;
}

/**
 * Salt hydrates that melt (phase-change packs): melting point, heat of fusion and the specific
 * heats of solid and melt. Lane, Solar Heat Storage: Latent Heat Materials, vol. 1 (CRC Press,
 * 1983), as listed in the review tables of Abhat (Solar Energy 30 (1983) 313) — from memory.
 * Congruent or not, each is treated as melting at its melting point into a liquid of its own
 * composition (the usual description of these materials in those tables).
 */
export interface MeltingHydrate {
  key: string;
  meltingPointC: number;
  latentHeatJPerG: number;
  solidCpJPerGK: number;
  liquidCpJPerGK: number;
  source: string;
}

const LANE = 'Lane 1983 / Abhat 1983 (from memory)';

export const MELTING_HYDRATES: readonly MeltingHydrate[] = [
  { key: 'CaCl2·6H2O(cr)', meltingPointC: 29.8, latentHeatJPerG: 187, solidCpJPerGK: 1.4, liquidCpJPerGK: 2.2, source: LANE },
  { key: 'Na2SO4·10H2O(cr)', meltingPointC: 32.4, latentHeatJPerG: 254, solidCpJPerGK: 1.9, liquidCpJPerGK: 3.3, source: LANE },
  { key: 'Na2CO3·10H2O(cr)', meltingPointC: 33, latentHeatJPerG: 247, solidCpJPerGK: 1.8, liquidCpJPerGK: 3.1, source: LANE },
  { key: 'Na2S2O3·5H2O(cr)', meltingPointC: 48, latentHeatJPerG: 201, solidCpJPerGK: 1.5, liquidCpJPerGK: 2.4, source: LANE },
  { key: 'CH3COONa·3H2O(cr)', meltingPointC: 58, latentHeatJPerG: 264, solidCpJPerGK: 1.9, liquidCpJPerGK: 3.0, source: LANE },
  { key: 'MgCl2·6H2O(cr)', meltingPointC: 116.7, latentHeatJPerG: 168.6, solidCpJPerGK: 2.25, liquidCpJPerGK: 2.61, source: LANE },
];

export function meltingHydrate(solidKey: string): MeltingHydrate | null {
  return MELTING_HYDRATES.find((h) => h.key === solidKey) ?? null;
}
