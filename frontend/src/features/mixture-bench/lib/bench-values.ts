import { evaluateMixtureRequestSchema, type EvaluateMixtureRequest } from '@shared/schemas/mixtures';
import type { LoadKind } from '@shared/schemas/briefs';
import type { ContactCase } from '@shared/thermal';

/** A contact case of the thermal model, or a UA given directly. */
export type ExchangeChoice = ContactCase['case'] | 'ua';

export type BenchComponentValues = {
  source: 'ingredient' | 'formula';
  ingredientId: string;
  formula: string;
  /** For a formula: the process chosen on the bench ('' = the one a chemist expects). */
  process: string;
  massG: string;
};

/** The bench's fields as typed. */
export type BenchValues = {
  components: BenchComponentValues[];
  initialTempC: string;
  ambientC: string;
  exchange: ExchangeChoice;
  uaWPerK: string;
  packHeatCapacityJPerK: string;
  holdMin: string;
  bandMinC: string;
  bandMaxC: string;
  /** What the pack heats or cools: 'none' or a load kind (schemas/briefs.ts). */
  loadKind: 'none' | LoadKind;
  loadMassG: string;
  loadCpJPerGK: string;
  loadInitialTempC: string;
  loadContactAreaM2: string;
  loadUaToPackWPerK: string;
  loadUaToEnvWPerK: string;
};

/** The bench's load fields, by the schema's key. */
export const LOAD_FIELDS = {
  massG: 'loadMassG',
  cpJPerGK: 'loadCpJPerGK',
  initialTempC: 'loadInitialTempC',
  contactAreaM2: 'loadContactAreaM2',
  uaToPackWPerK: 'loadUaToPackWPerK',
  uaToEnvWPerK: 'loadUaToEnvWPerK',
} as const;

export const BLANK_COMPONENT: BenchComponentValues = { source: 'ingredient', ingredientId: '', formula: '', process: '', massG: '' };

export const DEFAULT_BENCH: BenchValues = {
  components: [{ ...BLANK_COMPONENT }, { ...BLANK_COMPONENT }],
  initialTempC: '25',
  ambientC: '25',
  exchange: 'still-air',
  uaWPerK: '0.2',
  packHeatCapacityJPerK: '0',
  holdMin: '20',
  bandMinC: '',
  bandMaxC: '',
  loadKind: 'none',
  loadMassG: '227',
  loadCpJPerGK: '3.6',
  loadInitialTempC: '',
  loadContactAreaM2: '0.015',
  loadUaToPackWPerK: '',
  loadUaToEnvWPerK: '0',
};

export type BenchErrors = Record<string, string>;

function num(text: string): number | undefined {
  const trimmed = text.trim().replace(',', '.').replace('−', '-');
  if (trimmed === '') return undefined;
  const n = Number(trimmed);
  return Number.isFinite(n) ? n : Number.NaN;
}

function isBlank(c: BenchComponentValues): boolean {
  return (c.source === 'ingredient' ? c.ingredientId === '' : c.formula.trim() === '') && c.massG.trim() === '';
}

/** The schema's path → the bench field it belongs to. */
function benchField(path: string, rows: number[]): string {
  const m = /^components\.(\d+)\.?(.*)$/.exec(path);
  if (m) {
    const row = rows[Number(m[1])] ?? Number(m[1]);
    return `components.${row}.${m[2] || 'massG'}`;
  }
  if (path.startsWith('targetBand.minC')) return 'bandMinC';
  if (path.startsWith('targetBand')) return 'bandMaxC';
  if (path.startsWith('contact')) return 'exchange';
  const load = /^load\.(\w+)/.exec(path);
  if (load) return LOAD_FIELDS[load[1] as keyof typeof LOAD_FIELDS] ?? 'loadKind';
  return path || 'components';
}

/** "initialTempC must be a number (°C)" → "must be a number (°C)", to follow the field's own label. */
function fragment(message: string): string {
  return message.replace(/^[A-Za-z][\w.]* (?=must|give)/, '');
}

/**
 * Builds the POST /api/mixtures/evaluate request from the bench's fields and checks it with the
 * schema the server validates with. Blank component rows are left out. `rows[k]` is the bench
 * row of the request's k-th component, for placing errors.
 */
export function benchRequest(values: BenchValues): { request: EvaluateMixtureRequest | null; errors: BenchErrors; rows: number[] } {
  const rows: number[] = [];
  const components = values.components.flatMap((c, k) => {
    if (isBlank(c)) return [];
    rows.push(k);
    const massG = num(c.massG);
    return [
      c.source === 'ingredient'
        ? { ingredientId: c.ingredientId === '' ? undefined : Number(c.ingredientId), massG }
        : { formula: c.formula.trim() === '' ? undefined : c.formula.trim(), massG, ...(c.process ? { process: c.process } : {}) },
    ];
  });
  const errors: BenchErrors = {};
  values.components.forEach((c, k) => {
    if (isBlank(c)) return;
    if (c.source === 'ingredient' && c.ingredientId === '') errors[`components.${k}.ingredientId`] = 'Choose an ingredient.';
    if (c.source === 'formula' && c.formula.trim() === '') errors[`components.${k}.formula`] = 'Enter a formula such as NH4NO3.';
    if (c.massG.trim() === '') errors[`components.${k}.massG`] = 'Enter the mass in g.';
  });
  const minC = num(values.bandMinC);
  const maxC = num(values.bandMaxC);
  if ((minC === undefined) !== (maxC === undefined)) errors[minC === undefined ? 'bandMinC' : 'bandMaxC'] = 'Give both ends of the band, or neither.';
  const candidate = {
    components,
    initialTempC: num(values.initialTempC),
    ambientC: num(values.ambientC),
    ...(values.exchange === 'ua' ? { uaWPerK: num(values.uaWPerK) } : { contact: { case: values.exchange, geometry: {} } }),
    packHeatCapacityJPerK: num(values.packHeatCapacityJPerK) ?? 0,
    holdMin: num(values.holdMin),
    ...(minC !== undefined && maxC !== undefined ? { targetBand: { minC, maxC } } : {}),
    ...(values.loadKind !== 'none'
      ? {
          load: {
            kind: values.loadKind,
            massG: num(values.loadMassG),
            cpJPerGK: num(values.loadCpJPerGK),
            initialTempC: num(values.loadInitialTempC) ?? null,
            contactAreaM2: num(values.loadContactAreaM2) ?? null,
            uaToPackWPerK: num(values.loadUaToPackWPerK) ?? null,
            uaToEnvWPerK: num(values.loadUaToEnvWPerK) ?? 0,
          },
        }
      : {}),
  };
  const parsed = evaluateMixtureRequestSchema.safeParse(candidate);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = benchField(issue.path.map(String).join('.'), rows);
      if (!errors[field]) errors[field] = fragment(issue.message);
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { request: null, errors, rows };
  return { request: parsed.data, errors, rows };
}
