import { z } from 'zod';
import { STEFAN_BOLTZMANN_W_PER_M2K4 } from './constants';
import { ThermalModelError } from './errors';

/**
 * How a pack exchanges heat with its surroundings: UA (W/K) and the temperature it exchanges
 * with. Each coefficient names its source or says "assumption".
 */

/** Surface emissivity of a polymer pouch film (0.9; typical of plastics, from memory: 0.85–0.95). */
export const POUCH_EMISSIVITY = 0.9;
/**
 * Natural-convection coefficient of a small pouch in still air, W/(m²·K): 4 (assumption within
 * the 2–25 W/(m²·K) range textbooks give for free convection in gases, e.g. Incropera &
 * DeWitt, Fundamentals of Heat and Mass Transfer, Table 1.1; a 10–20 cm plate with 10–20 K
 * difference gives about 3–5 by the laminar plate correlations).
 */
export const STILL_AIR_CONVECTION_W_PER_M2K = 4;
/** Thickness of a fabric layer between pack and skin, mm (assumption: one layer of clothing or a cloth sleeve). */
export const FABRIC_THICKNESS_MM = 1;
/** Effective thermal conductivity of dry textile with trapped air, W/(m·K) (0.04–0.06, from memory; assumption 0.05). */
export const FABRIC_CONDUCTIVITY_W_PER_MK = 0.05;
/**
 * Thermal resistance of skin and subcutaneous tissue to the warm core, m²·K/W: 0.015
 * (assumption: ~5 mm of tissue at k ≈ 0.37 W/(m·K), a common value for skin; from memory).
 */
export const TISSUE_RESISTANCE_M2K_PER_W = 0.015;
/** Mean skin temperature, °C (33; common physiological value, from memory). */
export const SKIN_TEMP_C = 33;
/** Insulation around an insulated pack: 10 mm of closed-cell foam at 0.035 W/(m·K) (typical PE/EPS foam, from memory). */
export const INSULATION_THICKNESS_MM = 10;
export const INSULATION_CONDUCTIVITY_W_PER_MK = 0.035;
/** Pack density for the pouch-area estimate, g/cm³ (assumption: salt slurry, 1.3). */
export const PACK_DENSITY_G_PER_CM3 = 1.3;
/** Pouch thickness for the area estimate, mm (assumption: a filled flat pouch, 15 mm). */
export const POUCH_THICKNESS_MM = 15;

/**
 * Radiative heat-transfer coefficient linearised about the mean of two temperatures:
 * h_rad = 4·ε·σ·T_m³ (W/(m²·K), T_m in K). Stefan–Boltzmann law.
 *
 * @example radiativeCoefficientWPerM2K(0.9, 25) // ≈ 5.4
 */
export function radiativeCoefficientWPerM2K(emissivity: number, meanTempC: number): number {
  const t = meanTempC + 273.15;
  return 4 * emissivity * STEFAN_BOLTZMANN_W_PER_M2K4 * t * t * t;
}

export const packGeometrySchema = z.union([
  z.object({ areaM2: z.number().positive('areaM2 must be greater than 0') }),
  z.object({
    /** Pack mass, g; the caller may leave it out and pass the mixture's mass. */
    massG: z.number().positive().optional(),
    densityGPerCm3: z.number().positive().default(PACK_DENSITY_G_PER_CM3),
    thicknessMm: z.number().positive().default(POUCH_THICKNESS_MM),
  }),
]);
export type PackGeometry = z.input<typeof packGeometrySchema>;

/**
 * Surface area of a pack, m². Given directly, or as a flat pouch: volume V = m/ρ, one face
 * A₁ = V/thickness, both faces 2·A₁ (edges neglected).
 *
 * @example packAreaM2({ massG: 195, densityGPerCm3: 1.3, thicknessMm: 15 }) // → 0.02 (two 100 cm² faces)
 */
export function packAreaM2(geometry: PackGeometry, fallbackMassG?: number): number {
  const g = packGeometrySchema.parse(geometry);
  if ('areaM2' in g) return g.areaM2;
  const mass = g.massG ?? fallbackMassG;
  if (!(mass !== undefined && mass > 0)) {
    throw new ThermalModelError(`expected the pack's massG (> 0 g) to estimate its area, found ${mass}`, { field: 'contact.geometry.massG' });
  }
  const volumeCm3 = mass / g.densityGPerCm3;
  const faceCm2 = volumeCm3 / (g.thicknessMm / 10);
  return (2 * faceCm2) / 1e4;
}

export const contactSchema = z.discriminatedUnion('case', [
  z.object({
    case: z.literal('still-air'),
    geometry: packGeometrySchema,
    /** Convection coefficient, W/(m²·K); radiation is added at the ambient temperature. */
    convectionWPerM2K: z.number().positive().default(STILL_AIR_CONVECTION_W_PER_M2K),
    emissivity: z.number().min(0).max(1).default(POUCH_EMISSIVITY),
  }),
  z.object({
    case: z.literal('skin-fabric'),
    geometry: packGeometrySchema,
    skinTempC: z.number().min(20).max(40).default(SKIN_TEMP_C),
    fabricThicknessMm: z.number().min(0).default(FABRIC_THICKNESS_MM),
    fabricConductivityWPerMK: z.number().positive().default(FABRIC_CONDUCTIVITY_W_PER_MK),
    tissueResistanceM2KPerW: z.number().min(0).default(TISSUE_RESISTANCE_M2K_PER_W),
    convectionWPerM2K: z.number().positive().default(STILL_AIR_CONVECTION_W_PER_M2K),
    emissivity: z.number().min(0).max(1).default(POUCH_EMISSIVITY),
  }),
  z.object({
    case: z.literal('insulated'),
    geometry: packGeometrySchema,
    insulationThicknessMm: z.number().positive().default(INSULATION_THICKNESS_MM),
    insulationConductivityWPerMK: z.number().positive().default(INSULATION_CONDUCTIVITY_W_PER_MK),
    convectionWPerM2K: z.number().positive().default(STILL_AIR_CONVECTION_W_PER_M2K),
    emissivity: z.number().min(0).max(1).default(POUCH_EMISSIVITY),
  }),
]);
export type ContactCase = z.input<typeof contactSchema>;

export interface ContactResult {
  uaWPerK: number;
  /** Temperature the pack exchanges heat with: ambient, or the UA-weighted mean of skin and ambient. */
  envTempC: number;
  areaM2: number;
  /** How UA was built, for display. */
  terms: { path: string; uaWPerK: number; toTempC: number }[];
}

/**
 * UA of a contact case, W/K, and the temperature exchanged with.
 *
 * - still air: UA = (h_conv + h_rad)·A, h_rad = 4εσT³ at ambient; about 9 W/(m²·K) in all.
 * - skin through fabric: one face on skin through fabric and tissue in series,
 *   U_skin = 1/(t_f/k_f + R_tissue) to the skin temperature; the other face to still air.
 *   The two paths combine into one UA and a UA-weighted environment temperature (exact for
 *   a linear model).
 * - insulated: both faces through insulation then still air, U = 1/(t/k + 1/(h_conv + h_rad)).
 *
 * @example contactUA({ case: 'still-air', geometry: { areaM2: 0.02 } }, 25).uaWPerK // ≈ 0.19
 */
export function contactUA(contact: ContactCase, ambientC: number, fallbackMassG?: number): ContactResult {
  const c = contactSchema.parse(contact);
  const area = packAreaM2(c.geometry, fallbackMassG);
  const hAir = c.convectionWPerM2K + radiativeCoefficientWPerM2K(c.emissivity, ambientC);
  switch (c.case) {
    case 'still-air': {
      const ua = hAir * area;
      return { uaWPerK: ua, envTempC: ambientC, areaM2: area, terms: [{ path: 'still air, both faces', uaWPerK: ua, toTempC: ambientC }] };
    }
    case 'skin-fabric': {
      const face = area / 2;
      const uSkin = 1 / (c.fabricThicknessMm / 1000 / c.fabricConductivityWPerMK + c.tissueResistanceM2KPerW);
      const uaSkin = uSkin * face;
      const uaAir = hAir * face;
      const ua = uaSkin + uaAir;
      return {
        uaWPerK: ua,
        envTempC: (uaSkin * c.skinTempC + uaAir * ambientC) / ua,
        areaM2: area,
        terms: [
          { path: 'skin through fabric, one face', uaWPerK: uaSkin, toTempC: c.skinTempC },
          { path: 'still air, other face', uaWPerK: uaAir, toTempC: ambientC },
        ],
      };
    }
    case 'insulated': {
      const u = 1 / (c.insulationThicknessMm / 1000 / c.insulationConductivityWPerMK + 1 / hAir);
      const ua = u * area;
      return { uaWPerK: ua, envTempC: ambientC, areaM2: area, terms: [{ path: 'through insulation, both faces', uaWPerK: ua, toTempC: ambientC }] };
    }
  }
}
