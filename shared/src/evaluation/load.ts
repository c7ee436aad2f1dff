import type { Load, LoadInput, LoadKind } from '../schemas/briefs';
import { loadSchema } from '../schemas/briefs';
import { FABRIC_CONDUCTIVITY_W_PER_MK, FABRIC_THICKNESS_MM, STILL_AIR_CONVECTION_W_PER_M2K } from '../thermal/contact';
import { ThermalModelError } from '../thermal/errors';
import type { LumpedLoad } from '../thermal/time-profile';

/**
 * Contact conductance between a pack and its load per unit contact area, W/(m²·K), by kind:
 * - food or drink: a heater pad against a meal pouch in a sleeve, with a wet film between
 *   them: 50 W/(m²·K) (assumption; common practice, no source — a lab log of the pair
 *   calibrates it);
 * - a limb through fabric: one fabric layer, U = k_f / t_f (thermal/contact.ts: 1 mm at
 *   0.05 W/(m·K) → 50 W/(m²·K)); the tissue is the load itself;
 * - a cold-chain box's contents: still air between insert and contents, the free-convection
 *   coefficient of thermal/contact.ts (4 W/(m²·K); Incropera & DeWitt Table 1.1 range).
 */
export const LOAD_CONTACT_W_PER_M2K: Readonly<Record<LoadKind, number>> = {
  'food-drink': 50,
  'limb-through-fabric': FABRIC_CONDUCTIVITY_W_PER_MK / (FABRIC_THICKNESS_MM / 1000),
  'cold-chain-box': STILL_AIR_CONVECTION_W_PER_M2K,
};

/**
 * Temperature a load exchanges with besides the pack, °C: the ambient, except a limb, which the
 * blood keeps towards the body's core temperature (37 °C; common physiological value, from memory).
 */
export function loadEnvTempC(kind: LoadKind, ambientC: number): number {
  return kind === 'limb-through-fabric' ? 37 : ambientC;
}

/** Typical heat capacities of loads, J/(g·K), for the forms' hints (from memory; water 4.18, a wet meal about 3.6, lean tissue about 3.5). */
export const LOAD_CP_HINT_J_PER_GK: Readonly<Record<LoadKind, number>> = {
  'food-drink': 3.6,
  'limb-through-fabric': 3.5,
  'cold-chain-box': 4.18,
};

/**
 * A brief's (or the bench's) load as the time model's second lumped node: C = m·cp; UA to the
 * pack given directly or contact area × {@link LOAD_CONTACT_W_PER_M2K}; UA to the surroundings
 * as given, towards {@link loadEnvTempC}; start at the load's temperature or the ambient.
 *
 * @example lumpedLoad({ kind: 'food-drink', massG: 227, cpJPerGK: 3.6, contactAreaM2: 0.03 }, 21)
 * // → { heatCapacityJPerK: 817.2, uaToPackWPerK: 1.5, uaToEnvWPerK: 0, initialTempC: 21, envTempC: 21 }
 */
export function lumpedLoad(input: Load | LoadInput, ambientC: number): LumpedLoad & { envTempC: number } {
  const parsed = loadSchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    throw new ThermalModelError(`expected a valid load: ${issue?.path.join('.') ?? ''} ${issue?.message ?? 'invalid'}`.trim(), { field: `load.${issue?.path.join('.') ?? ''}` });
  }
  const l = parsed.data;
  return {
    heatCapacityJPerK: l.massG * l.cpJPerGK,
    initialTempC: l.initialTempC ?? ambientC,
    uaToPackWPerK: l.uaToPackWPerK ?? l.contactAreaM2! * LOAD_CONTACT_W_PER_M2K[l.kind],
    uaToEnvWPerK: l.uaToEnvWPerK,
    envTempC: loadEnvTempC(l.kind, ambientC),
  };
}
