import type { IngredientHazardData } from '../schemas/hazards';
import type { IngredientProcessInput } from '../thermal/process';

/**
 * An ingredient as the optimiser needs it. The back end maps its ingredient records to this
 * (id → string, costPerKg decimal string kept as is, process JSON, role); the demo library
 * (demo-library.ts, from shared/src/demo/ingredients.ts) is mapped to this shape.
 */
export interface OptimiserIngredient {
  id: string;
  name: string;
  /** `active` ingredients are enumerated into sets; the water ingredient is the `solvent`; `additive`s join when a set needs them. */
  role: 'active' | 'solvent' | 'additive' | 'packaging';
  /** Cost per kg in the workspace currency, decimal string (e.g. "2.40") or number. */
  costPerKg: string | number;
  /** The heat-producing process (thermal/process.ts); null or inert for water and additives. */
  process: IngredientProcessInput | null;
  /** Specific heat capacity of an inert ingredient, J/(g·K), when the process does not give one. */
  cpJPerGK?: number | null;
  densityGPerMl?: number | null;
  /** GHS hazard class codes given by hand; a brief's `excludedHazardClasses` leaves such ingredients out (with the tags of `hazardData`). */
  hazardClasses?: string[];
  /**
   * The ingredient's hazard data (GHS classes, ATEs, incompatibility groups, regulatory flags):
   * its tags join `hazardClasses` for the brief's filter (hazards/optimiser-hazards.ts), cap
   * tokens in `excludedHazardClasses` become concentration caps, and each candidate's hazard
   * notes and score are computed from it.
   */
  hazardData?: IngredientHazardData | null;
  /**
   * Other ingredients this one needs in the mixture, in grams per gram of this one: iron
   * powder needs salt, carbon, a water-holding filler and water. The optimiser adds them to
   * every set that contains this ingredient and constrains their ratio.
   */
  needs?: IngredientNeed[];
}

export interface IngredientNeed {
  ingredientId: string;
  minGPerG: number;
  /** Upper ratio; absent: no upper ratio. */
  maxGPerG?: number;
  /** Why (citation or common practice). */
  source?: string;
}

/** One set of active ingredients to solve, with the water and additives it brings. */
export interface IngredientSet {
  /** Sorted ids of the actives. */
  activeIds: string[];
  /** Every ingredient of the LP, in variable order: actives, then additives, then water (if any). */
  members: OptimiserIngredient[];
  /** A stable key, the active ids joined by `+`. */
  key: string;
}

export interface OptimiserWarning {
  code: string;
  message: string;
}
