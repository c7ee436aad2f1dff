import type { FieldErrors, Resolver } from 'react-hook-form';
import { createIngredientRequestSchema, type CreateIngredientRequest, type Ingredient, type IngredientRole } from '@shared/schemas/library';
import type { ProcessKind } from '@shared/thermal/process';

/**
 * What the ingredient form holds: text as typed. The resolver turns it into the request the API
 * takes and checks it with the very schema the server validates with
 * (`createIngredientRequestSchema`, which applies `ingredientProcessSchema` to the process JSON).
 */
export type IngredientFormValues = {
  name: string;
  grade: string;
  role: IngredientRole;
  speciesKey: string;
  /** The process as JSON text; empty for none. */
  process: string;
  costPerKg: string;
  currency: string;
  densityGPerMl: string;
  cpJPerGK: string;
  sources: { value: string }[];
  notes: string;
};

export const PROCESS_TEMPLATES: Record<ProcessKind, object> = {
  dissolution: { kind: 'dissolution', solidKey: 'NH4NO3(cr)', ionsPerFormulaUnit: 2 },
  reaction: {
    kind: 'reaction',
    reactants: [
      { key: 'CaO(cr)', coef: 1 },
      { key: 'H2O(l)', coef: 1 },
    ],
    products: [{ key: 'Ca(OH)2(cr)', coef: 1 }],
    ingredientKey: 'CaO(cr)',
  },
  crystallisation: { kind: 'crystallisation' },
  'air-oxidation': { kind: 'air-oxidation' },
  inert: { kind: 'inert', role: 'additive' },
};

export function formValuesFromIngredient(ingredient: Ingredient | null, currency: string): IngredientFormValues {
  if (!ingredient) {
    return {
      name: '',
      grade: '',
      role: 'active',
      speciesKey: '',
      process: JSON.stringify(PROCESS_TEMPLATES.dissolution, null, 2),
      costPerKg: '',
      currency,
      densityGPerMl: '',
      cpJPerGK: '',
      sources: [{ value: '' }],
      notes: '',
    };
  }
  return {
    name: ingredient.name,
    grade: ingredient.grade,
    role: ingredient.role,
    speciesKey: ingredient.speciesKey ?? '',
    process: ingredient.process ? JSON.stringify(ingredient.process, null, 2) : '',
    costPerKg: ingredient.costPerKg,
    currency: ingredient.currency,
    densityGPerMl: ingredient.densityGPerMl === null ? '' : String(ingredient.densityGPerMl),
    cpJPerGK: ingredient.cpJPerGK === null ? '' : String(ingredient.cpJPerGK),
    sources: ingredient.sources.map((value) => ({ value })),
    notes: ingredient.notes,
  };
}

function numberOrText(text: string): number | string | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const n = Number(trimmed);
  return Number.isFinite(n) ? n : trimmed;
}

/** The form's fields for a dotted schema path (`process.kind` → `process`, `sources.2` → `sources.2.value`). */
function formFieldOf(path: PropertyKey[], keptSources: number[]): string {
  const [head, second] = path.map(String);
  if (head === 'sources') return second !== undefined ? `sources.${keptSources[Number(second)] ?? second}.value` : 'sources';
  if (head === undefined || head === '') return 'root';
  return head;
}

export const ingredientFormResolver: Resolver<IngredientFormValues, unknown, CreateIngredientRequest> = async (values) => {
  const errors: Record<string, { type: string; message: string }> = {};
  let process: unknown = null;
  if (values.process.trim() !== '') {
    try {
      process = JSON.parse(values.process);
    } catch (error) {
      errors.process = { type: 'json', message: `is not valid JSON (${error instanceof Error ? error.message : 'parse error'})` };
    }
  }
  // Empty citation rows are left out; errors are mapped back to the row they came from.
  const keptSources = values.sources.flatMap((s, k) => (s.value.trim() === '' ? [] : [k]));
  const candidate = {
    name: values.name,
    grade: values.grade,
    role: values.role,
    speciesKey: values.speciesKey.trim() === '' ? null : values.speciesKey,
    process,
    costPerKg: values.costPerKg,
    currency: values.currency,
    densityGPerMl: numberOrText(values.densityGPerMl),
    cpJPerGK: numberOrText(values.cpJPerGK),
    sources: keptSources.map((k) => values.sources[k]!.value),
    notes: values.notes,
  };
  const parsed = createIngredientRequestSchema.safeParse(candidate);
  if (parsed.success && Object.keys(errors).length === 0) return { values: parsed.data, errors: {} };
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = formFieldOf(issue.path, keptSources);
      if (errors[field]) continue;
      // A process issue names the part of the JSON it concerns.
      const where = field === 'process' && issue.path.length > 1 ? `${issue.path.slice(1).join('.')}: ` : '';
      errors[field] = { type: issue.code, message: `${where}${issue.message}` };
    }
  }
  const nested: Record<string, unknown> = {};
  for (const [field, error] of Object.entries(errors)) {
    const match = /^sources\.(\d+)\.value$/.exec(field);
    if (match) {
      const list = (nested.sources as Array<{ value?: unknown }> | undefined) ?? [];
      list[Number(match[1])] = { value: error };
      nested.sources = list;
    } else nested[field] = error;
  }
  return { values: {}, errors: nested as FieldErrors<IngredientFormValues> };
};
