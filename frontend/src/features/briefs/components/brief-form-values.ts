import type { z } from 'zod';
import { LOAD_CP_HINT_J_PER_GK } from '@shared/evaluation/load';
import { BRIEF_DEFAULTS, briefSchema, type Brief, type LoadKind, type PackType } from '@shared/schemas/briefs';

/** What the brief form holds (the schema's input) and what it hands over once valid (its output). */
export type BriefFormInput = z.input<typeof briefSchema>;
export type BriefFormOutput = z.output<typeof briefSchema>;

/** Every field the server may name in a 400, so its message lands beside that field. */
export const BRIEF_FIELDS = [
  'name',
  'packType',
  'ambientC',
  'initialTempC',
  'targetTempC',
  'bandK',
  'reachWithinMin',
  'holdMin',
  'contact',
  'packAreaM2',
  'uaWPerK',
  'maxMassG',
  'maxUnitCost',
  'minSurfaceTempC',
  'maxSurfaceTempC',
  'maxGasL',
  'allowedIngredientIds',
  'excludedIngredientIds',
  'excludedHazardClasses',
  'objective',
  'maxActives',
  'allowIncompatible',
  'packaging.massG',
  'packaging.heatCapacityJPerK',
  'packaging.cost',
  'load',
  'load.kind',
  'load.massG',
  'load.cpJPerGK',
  'load.initialTempC',
  'load.uaToPackWPerK',
  'load.contactAreaM2',
  'load.uaToEnvWPerK',
  'notes',
] as const;

/** A new brief: the schema's own defaults (a sideline cold compress), with an empty name. */
export function newBriefValues(): BriefFormInput {
  const defaults = briefSchema.parse({ name: 'new' });
  return { ...defaults, name: '' };
}

/** The form's values for a stored brief (its spec has every default applied). */
export function briefValues(spec: Brief): BriefFormInput {
  // Briefs stored before the load was part of a brief have none.
  return { ...spec, packaging: { ...spec.packaging }, load: spec.load ? { ...spec.load } : null };
}

/** A load of a kind, as the form starts it: typical mass and heat capacity (evaluation/load.ts hints), coupled by a contact area. */
export function newLoadValues(kind: LoadKind): NonNullable<BriefFormInput['load']> {
  const massG = kind === 'food-drink' ? 227 : kind === 'limb-through-fabric' ? 1500 : 500;
  return { kind, massG, cpJPerGK: LOAD_CP_HINT_J_PER_GK[kind], initialTempC: null, uaToPackWPerK: null, contactAreaM2: 0.015, uaToEnvWPerK: 0 };
}

/** The pack-type defaults that follow a change of pack type (target and surface limits). */
export function packTypeDefaults(packType: PackType) {
  const d = BRIEF_DEFAULTS[packType];
  return { targetTempC: d.targetTempC, minSurfaceTempC: d.minSurfaceTempC, maxSurfaceTempC: d.maxSurfaceTempC };
}

/** Text typed into a number field: empty gives `empty` (undefined: use the default; null: none; NaN: required). */
export function numberFrom(empty: undefined | null | number) {
  return (value: unknown) => {
    if (value === null || value === undefined) return empty;
    if (typeof value === 'number') return value;
    const text = String(value).trim().replace(',', '.');
    return text === '' ? empty : Number(text);
  };
}

/** Money typed into a field: empty gives null (no limit) or stays '' for a required amount. */
export function moneyFrom(empty: null | '') {
  return (value: unknown) => {
    if (value === null || value === undefined) return empty;
    const text = String(value).trim().replace(',', '.');
    return text === '' ? empty : text;
  };
}

/**
 * A schema message as a sentence beside its field. Schema messages are fragments ("must be 0 or
 * more") or name the field by its key ("ambientC must be a number of °C"); both read with the
 * field's label instead.
 */
export function fieldSentence(label: string, field: string, message: string): string {
  const key = field.split('.').at(-1) ?? field;
  const withoutKey = message.startsWith(`${key} `) ? message.slice(key.length + 1) : message;
  const sentence = /^(must|is|at most|give)\b/.test(withoutKey)
    ? `${label} ${withoutKey}`
    : withoutKey.charAt(0).toUpperCase() + withoutKey.slice(1);
  return sentence.endsWith('.') ? sentence : `${sentence}.`;
}
