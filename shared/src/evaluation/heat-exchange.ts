import type { Brief } from '../schemas/briefs';
import { contactUA } from '../thermal/contact';

export interface HeatExchange {
  /** Overall conductance to the surroundings, W/K. */
  uaWPerK: number;
  /** Temperature the pack exchanges heat with, °C (for skin contact, the UA-weighted mean of skin and ambient). */
  envTempC: number;
}

/**
 * The thermal model's name for a brief's contact case (the brief says `skin-through-fabric`,
 * the contact model `skin-fabric`); the other cases share their names.
 *
 * @example thermalContactCase('skin-through-fabric') // → 'skin-fabric'
 */
export function thermalContactCase(contact: Brief['contact']): 'still-air' | 'skin-fabric' | 'insulated' {
  return contact === 'skin-through-fabric' ? 'skin-fabric' : contact;
}

/**
 * UA and exchange temperature of a brief: the brief's `uaWPerK` with its ambient temperature
 * when given, else the thermal model's contact case (thermal/contact.ts: convection plus
 * linearised radiation in still air; fabric and tissue in series to the skin on one face;
 * insulation in series) over the brief's `packAreaM2`. The linear model and the verification
 * use the same figures. `uaMultiplier` is an applied calibration of the contact case (not
 * applied to a UA the brief gives directly).
 *
 * @example resolveHeatExchange({ uaWPerK: null, contact: 'still-air', packAreaM2: 0.03, ambientC: 25 }).uaWPerK // ≈ 0.28
 */
export function resolveHeatExchange(brief: Pick<Brief, 'uaWPerK' | 'contact' | 'packAreaM2' | 'ambientC'>, uaMultiplier = 1): HeatExchange {
  if (brief.uaWPerK !== null && brief.uaWPerK !== undefined) return { uaWPerK: brief.uaWPerK, envTempC: brief.ambientC };
  const thermalCase = thermalContactCase(brief.contact);
  const c = contactUA({ case: thermalCase, geometry: { areaM2: brief.packAreaM2 } }, brief.ambientC);
  // A lab calibration of the contact case scales the modelled UA (lab-logs/calibrations.ts).
  return { uaWPerK: c.uaWPerK * uaMultiplier, envTempC: c.envTempC };
}
