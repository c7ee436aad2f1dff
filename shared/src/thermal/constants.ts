/**
 * Physical constants and default parameters of the thermal model. Each value names its
 * source; a value known only as a typical figure or chosen by us says "assumption".
 */

/** Reference temperature of the tabulated enthalpies (298.15 K). */
export const REFERENCE_TEMP_C = 25;

/** Specific heat capacity of liquid water at 25 °C, J/(g·K). IAPWS-95 (4.1813 J/(g·K)). */
export const WATER_CP_J_PER_GK = 4.1813;

/** Molar mass of water, g/mol (IUPAC 2021 abridged atomic weights: 2·1.008 + 15.999). */
export const WATER_MOLAR_MASS_G_PER_MOL = 18.015;

/**
 * Specific heat capacity of ice near −10 °C, J/(g·K). CRC Handbook, "Properties of Ice and
 * Supercooled Water" (2.05 J/(g·K) at −10 °C, 2.11 at 0 °C).
 */
export const ICE_CP_J_PER_GK = 2.05;

/** Enthalpy of fusion of ice at 0 °C, J/g. CRC Handbook (6.01 kJ/mol = 333.6 J/g). */
export const ICE_FUSION_J_PER_G = 333.6;

/** Cryoscopic constant of water, K·kg/mol. CRC Handbook, "Cryoscopic constants" (1.86). */
export const WATER_CRYOSCOPIC_K_KG_PER_MOL = 1.86;

/** Stefan–Boltzmann constant, W/(m²·K⁴) (CODATA 2018). */
export const STEFAN_BOLTZMANN_W_PER_M2K4 = 5.670374419e-8;

/** Oxygen mole fraction in dry air (0.2095; US Standard Atmosphere 1976). */
export const AIR_O2_MOLE_FRACTION = 0.2095;

/** Standard atmosphere, Pa. */
export const STANDARD_ATMOSPHERE_PA = 101325;

/**
 * Default dissolution rate constant, 1/min: first-order approach to the solubility-limited
 * extent. Assumption, chosen so a shaken instant cold pack reaches its lowest temperature in
 * about 2–3 minutes, the usual behaviour of such packs (common practice, not a measurement).
 */
export const DEFAULT_DISSOLUTION_RATE_PER_MIN = 1.5;
export const DEFAULT_DISSOLUTION_RATE_SOURCE =
  'assumption: time constant ~40 s, so a shaken cold pack bottoms out within 2–3 min (common practice)';

/** Default reaction rate constant, 1/min. Assumption (hydration of quicklime in excess water is complete within minutes). */
export const DEFAULT_REACTION_RATE_PER_MIN = 0.5;
export const DEFAULT_REACTION_RATE_SOURCE = 'assumption: reaction complete within about 5–10 min';

/**
 * Ice growth/melting rate constant, 1/min. Assumption: water–ice equilibrium is reached much
 * faster than dissolution (time constant 10 s).
 */
export const ICE_RATE_PER_MIN = 6;

/**
 * Sodium acetate trihydrate, CH3COONa·3H2O. Melting point 58 °C and latent heat of fusion
 * 264–289 J/g are the figures listed in reviews of salt-hydrate phase-change materials
 * (Lane, Solar Heat Storage: Latent Heat Materials, CRC Press 1983; Sharma et al.,
 * Renew. Sustain. Energy Rev. 13 (2009) 318–345), from memory. We default to the low end.
 */
export const SAT_MELTING_POINT_C = 58;
export const SAT_LATENT_HEAT_J_PER_G = 264;
export const SAT_LATENT_HEAT_SOURCE =
  'Lane 1983 and Sharma et al. 2009 list 264–289 J/g at 58 °C (from memory); low end used';
/** Heat capacities of solid and liquid sodium acetate trihydrate, J/(g·K): ~1.9 and ~3.0 (from memory; approximate). */
export const SAT_SOLID_CP_J_PER_GK = 1.9;
export const SAT_LIQUID_CP_J_PER_GK = 3.0;
/** Crystal growth rate constant, 1/min. Assumption: a triggered pouch crystallises through in tens of seconds. */
export const DEFAULT_CRYSTALLISATION_RATE_PER_MIN = 4;
/** Undercooling, K, at which crystal growth reaches its full rate. Assumption. */
export const DEFAULT_CRYSTALLISATION_DRIVING_K = 2;

/**
 * O2 permeance of a breathable pouch film, mol/(m²·s·Pa). Assumption, back-calculated from
 * the usual behaviour of a disposable hand warmer (common practice, no source): about 40 g of
 * mix (20 g iron) in a 13 × 9.5 cm pouch breathing through one face (0.0124 m²) reaches about
 * 55 °C in 20 °C still air and stays warm about 5 h — ~9 W, as 4Fe + 3O2 → 2Fe2O3 releases
 * ~550 kJ per mol O2 and the O2 difference is 0.2095 × 101325 Pa.
 */
export const DEFAULT_O2_PERMEANCE_MOL_PER_M2_S_PA = 5.5e-8;
/** Intrinsic oxidation rate constant of iron powder, 1/min (first order in remaining iron). Assumption. */
export const DEFAULT_OXIDATION_RATE_PER_MIN = 0.05;

/** Specific heat capacities of common inert parts, J/(g·K) (typical handbook values, from memory). */
export const INERT_CP_J_PER_GK = {
  /** Polyethylene film: ~1.9–2.3 J/(g·K). */
  packaging: 2.0,
  /** Mineral fillers, carbon, vermiculite: ~0.7–1.0 J/(g·K). */
  additive: 0.9,
} as const;

/** Heat capacity of a solid whose Cp° is not in the species data, J/(g·K). Assumption (typical salts 0.7–1.8). */
export const FALLBACK_SOLID_CP_J_PER_GK = 1.2;

/** Boiling point of water at 101.325 kPa, °C (IAPWS-95: 99.97 °C; 100 °C used). Boiling-point elevation by solutes is neglected (a few K in concentrated brines). */
export const WATER_BOILING_POINT_C = 100;

/** Enthalpy of vaporisation of water at 100 °C, J/g. IAPWS-95 (2256.4 kJ/kg). */
export const WATER_VAPORISATION_J_PER_G = 2256.4;

/**
 * Time constant with which boiling removes the heat that would lift the pack above the boiling
 * point, s. Assumption (boiling is fast next to the processes that heat the pack), chosen so
 * the temperature overshoots the boiling point by well under 1 K at pack heating rates.
 */
export const BOILING_TIME_CONSTANT_S = 2;
