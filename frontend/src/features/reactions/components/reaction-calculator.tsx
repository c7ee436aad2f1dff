import { useEffect, useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch, type Control, type UseFormRegister } from 'react-hook-form';
import { reactionAtTemperature } from '@shared/chemistry';
import { PHASES } from '@shared/schemas/library';
import { reactionRequestSchema, type ReactionRequest, type ReactionResponse } from '@shared/schemas/thermo';
import { LineChart, type ChartRule, type ChartSeries } from '@/components/charts/line-chart';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { cn } from '@/components/ui/cn';
import { EmptyState } from '@/components/ui/empty-state';
import { SelectField, TextField } from '@/components/ui/field';
import { Spinner } from '@/components/ui/spinner';
import { errorMessage, isApiError } from '@/lib/api-client';
import { formatNumber, formatQuantity } from '@/lib/format';
import { useReactionThermo } from '../api/get-reaction-thermo';

type Term = { formula: string; phase: string; coef: string };
type ReactionValues = { reactants: Term[]; products: Term[]; tempC: string };

const DEFAULTS: ReactionValues = {
  reactants: [
    { formula: 'CaO', phase: 'cr', coef: '1' },
    { formula: 'H2O', phase: 'l', coef: '1' },
  ],
  products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: '1' }],
  tempC: '25',
};

const PHASE_LABELS: Record<string, string> = { cr: 'cr (solid)', l: 'l (liquid)', g: 'g (gas)', aq: 'aq', ai: 'ai (ions)', ao: 'ao' };

function num(text: string): number | undefined {
  const t = text.trim().replace(',', '.').replace('−', '-');
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/** Builds the request from the fields and checks it with the schema the server validates with. */
function reactionRequest(values: ReactionValues): { request: ReactionRequest | null; errors: Record<string, string> } {
  const terms = (list: Term[]) =>
    list
      .filter((t) => t.formula.trim() !== '' || t.coef.trim() !== '')
      .map((t) => ({ formula: t.formula.trim(), ...(t.phase ? { phase: t.phase } : {}), coef: num(t.coef) }));
  const candidate = { reactants: terms(values.reactants), products: terms(values.products), tempC: num(values.tempC) ?? 25 };
  const parsed = reactionRequestSchema.safeParse(candidate);
  const errors: Record<string, string> = {};
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = issue.path.map(String).join('.');
      if (!errors[field]) errors[field] = issue.message;
    }
    return { request: null, errors };
  }
  return { request: parsed.data, errors };
}

/** Debounces a value: the last one, `delayMs` after it stopped changing. */
function useDebounced<T>(value: T, key: string, delayMs: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), delayMs);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key, delayMs]);
  return debounced;
}

export function ReactionCalculator() {
  const form = useForm<ReactionValues>({ defaultValues: DEFAULTS });
  const values = useWatch({ control: form.control }) as ReactionValues;
  const key = JSON.stringify(values);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const local = useMemo(() => reactionRequest(values), [key]);
  const request = useDebounced(local.request, JSON.stringify(local.request), 300);
  const thermo = useReactionThermo(request);

  // The server names the field an error belongs to (unknown species at reactants.1.formula, imbalance at products).
  const serverErrors: Record<string, string> = {};
  if (thermo.isError && isApiError(thermo.error)) for (const f of thermo.error.fields) serverErrors[f.field] = f.message;
  const errorOf = (field: string) => local.errors[field] ?? serverErrors[field];
  const sideError = (side: 'reactants' | 'products') => local.errors[side] ?? serverErrors[side];
  const unplaced = thermo.isError && (!isApiError(thermo.error) || thermo.error.fields.length === 0) ? errorMessage(thermo.error) : null;
  const tempError = local.errors.tempC ?? serverErrors.tempC;

  return (
    <div className="grid grid-cols-1 items-start gap-gutter lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]">
      <Card>
        <CardHeader title="Reaction" description="Formula, phase and coefficient of each species; the reaction must balance." />
        <CardBody>
          <form noValidate onSubmit={(e) => e.preventDefault()} className="flex flex-col gap-5">
            <TermList side="reactants" title="Reactants" control={form.control} register={form.register} errorOf={errorOf} sideError={sideError('reactants')} />
            <TermList side="products" title="Products" control={form.control} register={form.register} errorOf={errorOf} sideError={sideError('products')} />
            <TextField label="Temperature (°C)" inputMode="decimal" error={tempError} containerClassName="max-w-48" {...form.register('tempC')} />
          </form>
        </CardBody>
      </Card>

      <Card>
        <CardHeader
          title="Thermodynamics"
          description="Standard-state values from the species data, Kirchhoff-corrected to the temperature."
          action={thermo.isFetching ? <span role="status" className="flex items-center gap-2 text-caption text-ink-500"><Spinner size="sm" /> Updating…</span> : undefined}
        />
        <CardBody>
          <div aria-live="polite" className="flex flex-col gap-4">
            {unplaced && <Alert tone="danger" title="This reaction could not be evaluated">{unplaced}</Alert>}
            {thermo.isError && !unplaced && (
              <Alert tone="danger" title="Fix the reaction">{errorMessage(thermo.error)}</Alert>
            )}
            {!request && !thermo.data ? (
              <EmptyState title="Enter a balanced reaction">At least one reactant and one product, each with a coefficient.</EmptyState>
            ) : thermo.isPending ? (
              <p role="status" className="flex items-center gap-2 text-ink-500"><Spinner /> Evaluating…</p>
            ) : thermo.data ? (
              <ReactionResult result={thermo.data} stale={thermo.isError || thermo.isPlaceholderData || !local.request} />
            ) : null}
          </div>
        </CardBody>
      </Card>
    </div>
  );
}

function TermList({
  side,
  title,
  control,
  register,
  errorOf,
  sideError,
}: {
  side: 'reactants' | 'products';
  title: string;
  control: Control<ReactionValues>;
  register: UseFormRegister<ReactionValues>;
  errorOf: (field: string) => string | undefined;
  sideError?: string;
}) {
  const terms = useFieldArray({ control, name: side });
  const singular = side === 'reactants' ? 'Reactant' : 'Product';
  return (
    <fieldset className={cn('flex flex-col gap-2 rounded-control', sideError && 'border-l-4 border-rust-500 pl-3')} aria-describedby={sideError ? `${side}-error` : undefined}>
      <legend className="mb-1 text-small font-bold text-ink-900">{title}</legend>
      <div aria-hidden="true" className="grid grid-cols-[5rem_minmax(0,1fr)_8.5rem_4.5rem] gap-2 text-caption font-semibold text-ink-600">
        <span>Coefficient (mol)</span>
        <span>Formula</span>
        <span>Phase</span>
      </div>
      {terms.fields.map((field, k) => (
        <div key={field.id} className="grid grid-cols-[5rem_minmax(0,1fr)_8.5rem_4.5rem] items-start gap-2">
          <TextField label={`${singular} ${k + 1}: coefficient (mol)`} hideLabel inputMode="decimal" error={errorOf(`${side}.${k}.coef`)} {...register(`${side}.${k}.coef`)} />
          <TextField
            label={`${singular} ${k + 1}: formula`}
            hideLabel
            autoComplete="off"
            spellCheck={false}
            error={errorOf(`${side}.${k}.formula`)}
            {...register(`${side}.${k}.formula`)}
          />
          <SelectField label={`${singular} ${k + 1}: phase`} hideLabel error={errorOf(`${side}.${k}.phase`)} {...register(`${side}.${k}.phase`)}>
            <option value="">from formula</option>
            {PHASES.map((p) => (
              <option key={p} value={p}>
                {PHASE_LABELS[p] ?? p}
              </option>
            ))}
          </SelectField>
          <Button variant="ghost" size="sm" className="mt-1" disabled={terms.fields.length <= 1} onClick={() => terms.remove(k)}>
            Remove<span className="sr-only"> {singular.toLowerCase()} {k + 1}</span>
          </Button>
        </div>
      ))}
      {sideError && (
        <p id={`${side}-error`} role="alert" className="text-caption font-semibold text-rust-600">
          {title} {sideError}
        </p>
      )}
      <Button variant="secondary" size="sm" className="self-start" onClick={() => terms.append({ formula: '', phase: '', coef: '1' })}>
        Add a {singular.toLowerCase()}
      </Button>
    </fieldset>
  );
}

function ReactionResult({ result, stale }: { result: ReactionResponse; stale: boolean }) {
  const { series, rules } = useMemo(() => dgCurves(result), [result]);
  const t = formatQuantity(result.tempC, '°C', 1);
  return (
    <div className={cn('flex flex-col gap-5 transition-opacity', stale && 'opacity-60')}>
      <dl className="grid grid-cols-3 gap-3">
        <Figure label={`ΔH at ${t}`} value={formatQuantity(result.dH_kJ, 'kJ', 2)} />
        <Figure label={`ΔS at ${t}`} value={result.dS_J_per_K === null ? 'no data' : formatQuantity(result.dS_J_per_K, 'J/K', 2)} />
        <Figure label={`ΔG at ${t}`} value={result.dG_kJ === null ? 'no data' : formatQuantity(result.dG_kJ, 'kJ', 2)} />
      </dl>
      <p className="rounded-control bg-ink-50 px-3 py-2 text-body font-semibold text-ink-900">
        {result.favourabilityText.charAt(0).toUpperCase() + result.favourabilityText.slice(1)}.
        <span className="ml-1 font-normal text-ink-600">
          {result.dH_kJ < 0 ? 'It releases heat (exothermic).' : 'It absorbs heat (endothermic).'}
        </span>
      </p>
      {series.length > 0 ? (
        <LineChart
          title="ΔG against temperature"
          description="Negative ΔG means the reaction as written is favourable in standard states."
          series={series}
          rules={rules}
          x={{ label: 'Temperature', unit: '°C', format: (v) => formatNumber(v, { maxFractionDigits: 0 }) }}
          y={{ label: 'ΔG', unit: 'kJ', includeZero: true, format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
          tableCaption="ΔG (kJ) against temperature (°C)"
        />
      ) : (
        <EmptyState title="No ΔG curve">The species data lack an entropy, so ΔG cannot be computed.</EmptyState>
      )}
      <p className="text-caption text-ink-500">
        Standard values at 25 °C: ΔH° {formatQuantity(result.dH298_kJ, 'kJ', 2)}, ΔS° {result.dS298_J_per_K === null ? '—' : formatQuantity(result.dS298_J_per_K, 'J/K', 2)}, ΔCp{' '}
        {result.dCp_J_per_K === null ? '—' : formatQuantity(result.dCp_J_per_K, 'J/K', 2)}.
        {result.crossoverKirchhoffC !== null && ` Crossover with ΔCp: ${formatQuantity(result.crossoverKirchhoffC, '°C', 0)}.`}
      </p>
      {result.warnings.length > 0 && (
        <Alert tone="caution" title="Warnings">
          <ul className="list-disc pl-4">
            {result.warnings.map((w, k) => (
              <li key={`${w.code}-${k}`}>{w.message}</li>
            ))}
          </ul>
        </Alert>
      )}
      <details className="text-small">
        <summary className="cursor-pointer font-semibold text-ink-700">Species used and their sources</summary>
        <ul className="mt-2 flex flex-col gap-1 text-caption text-ink-600">
          {result.terms.map((term) => (
            <li key={term.key}>
              <span className="font-mono font-semibold text-ink-800">{term.key}</span> ({term.name}, ν = {formatNumber(term.nu, { maxFractionDigits: 3 })}): {term.source}
            </li>
          ))}
        </ul>
      </details>
    </div>
  );
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded-control border border-ink-100 bg-ink-50/50 px-3 py-2">
      <dt className="text-caption font-semibold text-ink-500">{label}</dt>
      <dd className="text-title font-extrabold tabular-nums text-ink-950">{value}</dd>
    </div>
  );
}

/** ΔG(T) with constant ΔH°, ΔS° and with the Kirchhoff correction, over a range that shows the crossover. */
function dgCurves(result: ReactionResponse): { series: ChartSeries[]; rules: ChartRule[] } {
  if (result.dS298_J_per_K === null) return { series: [], rules: [] };
  const crossings = [result.crossoverC, result.crossoverKirchhoffC].filter((c): c is number => c !== null && c > -200 && c < 3000);
  const lo = Math.max(-200, Math.min(0, result.tempC - 25));
  const hi = Math.min(3000, Math.max(result.tempC + 100, 400, ...crossings.map((c) => c * 1.2 + 50)));
  const steps = 120;
  const temps = Array.from({ length: steps + 1 }, (_, k) => lo + ((hi - lo) * k) / steps);
  const constant = temps.map((tc) => {
    const T = tc + 273.15;
    return { x: tc, y: result.dH298_kJ - (T * result.dS298_J_per_K!) / 1000 };
  });
  const series: ChartSeries[] = [{ id: 'constant', label: 'ΔG with constant ΔH°, ΔS°', tone: 'ink', points: constant }];
  if (result.dCp_J_per_K !== null) {
    series.push({
      id: 'kirchhoff',
      label: 'ΔG with ΔCp (Kirchhoff)',
      tone: 'ember',
      dashed: true,
      points: temps.map((tc) => ({ x: tc, y: reactionAtTemperature(result, tc).dG_kJ ?? Number.NaN })),
    });
  }
  const rules: ChartRule[] = [{ axis: 'y', value: 0, label: 'ΔG = 0', tone: 'rust' }];
  if (result.crossoverC !== null && result.crossoverC > lo && result.crossoverC < hi) {
    rules.push({ axis: 'x', value: result.crossoverC, label: `Crossover ${formatQuantity(result.crossoverC, '°C', 0)}`, tone: 'rust' });
  }
  rules.push({ axis: 'x', value: result.tempC, label: `${formatQuantity(result.tempC, '°C', 0)}`, tone: 'frost' });
  return { series, rules };
}
