import { z } from 'zod';
import { textSchema } from '../validation/text';
import {
  DEFAULT_CRYSTALLISATION_DRIVING_K,
  DEFAULT_CRYSTALLISATION_RATE_PER_MIN,
  DEFAULT_DISSOLUTION_RATE_PER_MIN,
  DEFAULT_DISSOLUTION_RATE_SOURCE,
  DEFAULT_O2_PERMEANCE_MOL_PER_M2_S_PA,
  DEFAULT_OXIDATION_RATE_PER_MIN,
  DEFAULT_REACTION_RATE_PER_MIN,
  DEFAULT_REACTION_RATE_SOURCE,
  SAT_LATENT_HEAT_J_PER_G,
  SAT_LATENT_HEAT_SOURCE,
  SAT_LIQUID_CP_J_PER_GK,
  SAT_MELTING_POINT_C,
  SAT_SOLID_CP_J_PER_GK,
} from './constants';

/**
 * The heat-producing process an ingredient carries (DEVELOPERS.md, "Ingredient processes"). The backend stores the
 * parsed value as JSON on each ingredient; the thermal model reads it.
 */

/** A species key `formula(phase)`, e.g. `NH4NO3(cr)`, `H2O(l)`, `O2(g)`. */
const speciesKeySchema = textSchema()
  .trim()
  .max(120, 'must be at most 120 characters')
  .regex(/^.+\((cr|l|g|aq|ai|ao)\)$/, 'must be a species key such as NH4NO3(cr) (formula, then phase in brackets)');

const positive = (what: string) => z.number({ error: `${what} must be a number` }).positive(`${what} must be greater than 0`);
const nonNegative = (what: string) => z.number({ error: `${what} must be a number` }).min(0, `${what} must be 0 or more`);

export const eutecticSchema = z.object({
  tempC: z.number().max(0, 'a salt–water eutectic lies at or below 0 °C'),
  soluteMassFraction: z.number().gt(0).lt(1),
  source: textSchema().min(1, 'name the source of the eutectic').max(1000, 'must be at most 1000 characters'),
});

/** Dissolution of a solid (anhydrous salt or hydrate) in the pack's water. */
export const dissolutionProcessSchema = z.object({
  kind: z.literal('dissolution'),
  /** Species key of the solid as charged into the pack, e.g. `NH4NO3(cr)`, `CaCl2·6H2O(cr)`. */
  solidKey: speciesKeySchema,
  /** Species key of the anhydrous solute the dilution and solubility data refer to; defaults to solidKey. */
  soluteKey: speciesKeySchema.optional(),
  /** Mol of water of crystallisation released per mol of solid (6 for CaCl2·6H2O). */
  hydrateWaterPerFormula: nonNegative('hydrateWaterPerFormula').default(0),
  /** Ions (or particles) per formula unit in solution, for the freezing-point estimate: 2 for NH4NO3, 1 for urea. */
  ionsPerFormulaUnit: z.number().int().min(1).max(6).default(2),
  rateConstantPerMin: positive('rateConstantPerMin').default(DEFAULT_DISSOLUTION_RATE_PER_MIN),
  rateConstantSource: textSchema().min(1).max(1000, 'must be at most 1000 characters').default(DEFAULT_DISSOLUTION_RATE_SOURCE),
  /** Specific heat capacity of the undissolved solid, J/(g·K); default from the species Cp°. */
  solidCp_J_per_gK: positive('solidCp_J_per_gK').optional(),
  /** Salt–water eutectic; when absent the chemistry data are asked, then a colligative estimate is used. */
  eutectic: eutecticSchema.optional(),
});

const stoichiometricTermSchema = z.object({
  key: speciesKeySchema,
  coef: positive('coef'),
});

/**
 * A balanced reaction. `H2O(l)` among the reactants is drawn from the pack's free water and
 * among the products returned to it; gas products leave the pack.
 */
export const reactionProcessSchema = z.object({
  kind: z.literal('reaction'),
  reactants: z.array(stoichiometricTermSchema).min(1),
  products: z.array(stoichiometricTermSchema).min(1),
  /** The reactant this ingredient is. */
  ingredientKey: speciesKeySchema,
  /**
   * `limiting`: the ingredient's mass is this reactant alone; other non-water reactants are
   * assumed present in excess in other components. `premix`: the ingredient's mass holds all
   * non-water reactants in stoichiometric ratio.
   */
  basis: z.enum(['limiting', 'premix']).default('limiting'),
  /** ΔrH per mol of reaction as written, kJ; default from the species data by Hess's law. */
  dH_kJ_per_mol: z.number().optional(),
  dHSource: textSchema().max(1000, 'must be at most 1000 characters').optional(),
  rateConstantPerMin: positive('rateConstantPerMin').default(DEFAULT_REACTION_RATE_PER_MIN),
  rateConstantSource: textSchema().min(1).max(1000, 'must be at most 1000 characters').default(DEFAULT_REACTION_RATE_SOURCE),
});

/** Crystallisation of a supercooled melt (sodium acetate trihydrate); plateau at the melting point. */
export const crystallisationProcessSchema = z.object({
  kind: z.literal('crystallisation'),
  meltingPointC: z.number().default(SAT_MELTING_POINT_C),
  latentHeat_J_per_g: positive('latentHeat_J_per_g').default(SAT_LATENT_HEAT_J_PER_G),
  latentHeatSource: textSchema().min(1).max(1000, 'must be at most 1000 characters').default(SAT_LATENT_HEAT_SOURCE),
  liquidCp_J_per_gK: positive('liquidCp_J_per_gK').default(SAT_LIQUID_CP_J_PER_GK),
  solidCp_J_per_gK: positive('solidCp_J_per_gK').default(SAT_SOLID_CP_J_PER_GK),
  rateConstantPerMin: positive('rateConstantPerMin').default(DEFAULT_CRYSTALLISATION_RATE_PER_MIN),
  /** Undercooling at which growth reaches its full rate, K. */
  drivingRangeK: positive('drivingRangeK').default(DEFAULT_CRYSTALLISATION_DRIVING_K),
});

/**
 * Air oxidation of a metal powder, by default 4Fe + 3O2 → 2Fe2O3. The O2 supply is
 * film permeance × film area × O2 partial-pressure difference, capped by the metal load.
 */
export const airOxidationProcessSchema = z.object({
  kind: z.literal('air-oxidation'),
  metalKey: speciesKeySchema.default('Fe(cr)'),
  oxideKey: speciesKeySchema.default('Fe2O3(cr)'),
  /** Mol of metal per mol of O2 (4/3 for 4Fe + 3O2). */
  metalPerO2: positive('metalPerO2').default(4 / 3),
  /** Mol of oxide per mol of O2 (2/3 for 4Fe + 3O2 → 2Fe2O3). */
  oxidePerO2: positive('oxidePerO2').default(2 / 3),
  /** Heat per mol O2, kJ (negative: released); default from the species data by Hess's law. */
  dH_kJ_per_mol_O2: z.number().negative().optional(),
  filmO2Permeance_mol_per_m2_s_Pa: positive('filmO2Permeance_mol_per_m2_s_Pa').default(DEFAULT_O2_PERMEANCE_MOL_PER_M2_S_PA),
  /** Breathable film area through which O2 enters, m²; default one face of the pouch (half the pack's surface). */
  filmAreaM2: positive('filmAreaM2').optional(),
  /** O2 partial pressure outside minus inside, Pa; default 0.2095 × 101325 Pa with no O2 left inside. */
  o2PressureDifferencePa: positive('o2PressureDifferencePa').optional(),
  rateConstantPerMin: positive('rateConstantPerMin').default(DEFAULT_OXIDATION_RATE_PER_MIN),
});

/** Water as solvent, additives and packaging: heat capacity only. */
export const inertProcessSchema = z.object({
  kind: z.literal('inert'),
  /** `water` joins the solvent; the others only carry heat capacity. */
  role: z.enum(['water', 'additive', 'packaging']),
  /** J/(g·K); default by role (water: solution model; others: constants.INERT_CP_J_PER_GK). */
  cp_J_per_gK: positive('cp_J_per_gK').optional(),
  cpSource: textSchema().max(1000, 'must be at most 1000 characters').optional(),
});

export const ingredientProcessSchema = z.discriminatedUnion('kind', [
  dissolutionProcessSchema,
  reactionProcessSchema,
  crystallisationProcessSchema,
  airOxidationProcessSchema,
  inertProcessSchema,
]);

export type DissolutionProcess = z.infer<typeof dissolutionProcessSchema>;
export type ReactionProcess = z.infer<typeof reactionProcessSchema>;
export type CrystallisationProcess = z.infer<typeof crystallisationProcessSchema>;
export type AirOxidationProcess = z.infer<typeof airOxidationProcessSchema>;
export type InertProcess = z.infer<typeof inertProcessSchema>;
/** A parsed process, defaults applied. */
export type IngredientProcess = z.infer<typeof ingredientProcessSchema>;
/** A process as written by a user or stored in JSON, defaults optional. */
export type IngredientProcessInput = z.input<typeof ingredientProcessSchema>;
export type ProcessKind = IngredientProcess['kind'];
