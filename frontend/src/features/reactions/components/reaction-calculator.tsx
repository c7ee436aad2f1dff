import { useEffect, useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch, type Control, type UseFormRegister, type UseFormSetValue } from 'react-hook-form';
import { PHASES } from '@shared/schemas/library';
import { stoichiometricCharge } from '@shared/chemistry/pack-reaction';
import { reactionRequestSchema, type ReactionRequest, type ReactionResponse } from '@shared/schemas/thermo';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { EmptyState } from '@/components/ui/empty-state';
import { SelectField, TextField } from '@/components/ui/field';
import { phaseInWords } from '@/components/ui/formula';
import { Spinner } from '@/components/ui/spinner';
import { errorMessage, isApiError } from '@/lib/api-client';
import { useReactionThermo } from '../api/get-reaction-thermo';
import { PackAnswers } from './pack-answers';
import { num, packTerms, reagentRows, type ReactionValues, type Term } from './pack-terms';


/** A quicklime heater: 40 g CaO with its water of reaction and five times the reagents' mass in water as heat sink. */
const DEFAULTS: ReactionValues = {
  reactants: [
    { formula: 'CaO', phase: 'cr', coef: '1', massG: '40' },
    { formula: 'H2O', phase: 'l', coef: '1', massG: '13' },
  ],
  products: [{ formula: 'Ca(OH)2', phase: 'cr', coef: '1', massG: '' }],
  tempC: '20',
  waterRatio: '5',
};

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

/** The grams and the water ratio, checked here (the server does not need them). */
export function chargeErrors(values: ReactionValues): Record<string, string> {
  const errors: Record<string, string> = {};
  values.reactants.forEach((t, k) => {
    const g = num(t.massG);
    if (g !== undefined && !(g >= 0)) errors[`reactants.${k}.massG`] = 'must be a number of grams, 0 or more';
    else if (g !== undefined && g > 100_000) errors[`reactants.${k}.massG`] = 'must be at most 100 000 g';
  });
  const w = num(values.waterRatio);
  if (w !== undefined && !(w >= 0 && w <= 1000)) errors.waterRatio = 'must be a number from 0 to 1000';
  return errors;
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
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const charge = useMemo(() => chargeErrors(values), [key]);
  const request = useDebounced(local.request, JSON.stringify(local.request), 300);
  const thermo = useReactionThermo(request);

  // The server names the field an error belongs to (unknown species at reactants.1.formula, imbalance at products).
  const serverErrors: Record<string, string> = {};
  if (thermo.isError && isApiError(thermo.error)) for (const f of thermo.error.fields) serverErrors[f.field] = f.message;
  const errorOf = (field: string) => local.errors[field] ?? charge[field] ?? serverErrors[field];
  const sideError = (side: 'reactants' | 'products') => local.errors[side] ?? serverErrors[side];
  const unplaced = thermo.isError && (!isApiError(thermo.error) || thermo.error.fields.length === 0) ? errorMessage(thermo.error) : null;

  return (
    <div className="grid grid-cols-1 items-start gap-gutter xl:grid-cols-[minmax(0,6fr)_minmax(0,5fr)]">
      <section aria-labelledby="pack-answers-title" className="order-2 flex min-w-0 flex-col gap-4">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="pack-answers-title" className="text-lead font-bold text-ink-900">
            What this charge does in a pack
          </h2>
          {thermo.isFetching && (
            <span role="status" className="flex items-center gap-2 text-caption text-ink-500">
              <Spinner size="sm" /> Updating…
            </span>
          )}
        </div>
        <div aria-live="polite" className="flex flex-col gap-4">
          {unplaced && <Alert tone="danger" title="This reaction could not be evaluated">{unplaced}</Alert>}
          {thermo.isError && !unplaced && <Alert tone="danger" title="Fix the reaction">{errorMessage(thermo.error)}</Alert>}
          {!request && !thermo.data ? (
            <EmptyState title="Write a balanced reaction">At least one reagent and one product, each with a number of moles.</EmptyState>
          ) : thermo.isPending ? (
            <p role="status" className="flex items-center gap-2 text-ink-500">
              <Spinner /> Working it out…
            </p>
          ) : thermo.data ? (
            <PackAnswers
              result={thermo.data}
              values={values}
              chargeValid={Object.keys(charge).length === 0}
              stale={thermo.isError || thermo.isPlaceholderData || !local.request}
            />
          ) : null}
        </div>
      </section>

      <section aria-labelledby="charge-title" className="order-1 min-w-0 rounded-card border border-ink-100 bg-surface shadow-card">
        <header className="border-b border-ink-100 px-5 py-4">
          <h2 id="charge-title" className="text-lead font-bold text-ink-900">
            The charge
          </h2>
          <p className="mt-0.5 text-small text-ink-500">
            The reaction as it runs in the pack, and how many grams of each reagent go in. A reagent left without grams counts as in excess.
          </p>
        </header>
        <form noValidate onSubmit={(e) => e.preventDefault()} className="flex flex-col gap-5 px-5 py-4">
          <TermList side="reactants" title="Reagents" control={form.control} register={form.register} errorOf={errorOf} sideError={sideError('reactants')} />
          <StoichiometricFill values={values} result={thermo.data} setValue={form.setValue} />
          <TermList side="products" title="Products" control={form.control} register={form.register} errorOf={errorOf} sideError={sideError('products')} />
          <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
            <TextField
              label="Water as heat sink (g per g of reagents)"
              hint="Free water beyond what the reaction uses; it takes up heat."
              inputMode="decimal"
              error={errorOf('waterRatio')}
              {...form.register('waterRatio')}
            />
            <TextField
              label="Room temperature (°C)"
              hint="Where the pack starts and is stored."
              inputMode="decimal"
              error={local.errors.tempC ?? serverErrors.tempC}
              {...form.register('tempC')}
            />
          </div>
        </form>
      </section>
    </div>
  );
}

/** Sets the other reagents' grams to match the first one's, in the proportions of the reaction (shared stoichiometricCharge). */
function StoichiometricFill({ values, result, setValue }: { values: ReactionValues; result: ReactionResponse | undefined; setValue: UseFormSetValue<ReactionValues> }) {
  const first = num(values.reactants[0]?.massG);
  const rows = reagentRows(values);
  const terms = result ? packTerms(result) : null;
  const reagentTerms = terms?.filter((t) => t.nu < 0) ?? [];
  const usable = terms !== null && rows.length > 1 && rows[0] === 0 && reagentTerms.length === rows.length && first !== undefined && first > 0;
  return (
    <div className="-mt-2 flex flex-wrap items-center gap-x-2 text-caption text-ink-500">
      <Button
        variant="ghost"
        size="sm"
        disabled={!usable}
        aria-describedby="stoich-why"
        onClick={() => {
          if (!usable) return;
          const grams = stoichiometricCharge(terms, first);
          rows.forEach((row, k) => {
            const g = grams[reagentTerms[k]!.key];
            if (k > 0 && g !== undefined) setValue(`reactants.${row}.massG`, String(Math.round(g * 100) / 100), { shouldDirty: true });
          });
        }}
      >
        Match the other reagents to the first
      </Button>
      <span id="stoich-why">{usable ? 'in the proportions of the reaction, nothing left over.' : 'Needs two or more reagents, grams for the first, and a reaction that balances.'}</span>
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
  const singular = side === 'reactants' ? 'Reagent' : 'Product';
  const withMass = side === 'reactants';
  const columns = withMass ? 'sm:grid-cols-[4.5rem_minmax(0,1fr)_9rem_5.5rem_auto]' : 'sm:grid-cols-[4.5rem_minmax(0,1fr)_9rem_auto]';
  return (
    <fieldset className={cn('flex min-w-0 flex-col gap-2 rounded-control', sideError && 'border-l-4 border-rust-500 pl-3')} aria-describedby={sideError ? `${side}-error` : undefined}>
      <legend className="mb-1 text-small font-bold text-ink-900">{title}</legend>
      <div aria-hidden="true" className={cn('hidden gap-2 text-caption font-semibold text-ink-600 sm:grid', columns)}>
        <span>Moles</span>
        <span>Formula</span>
        <span>State</span>
        {withMass && <span>Grams</span>}
      </div>
      {terms.fields.map((field, k) => (
        // On a phone: moles and formula on one line, state, grams and Remove on the next.
        <div key={field.id} className={cn('grid grid-cols-[4rem_minmax(0,1fr)_5.5rem_auto] items-start gap-2 border-b border-ink-100 pb-2 sm:border-0 sm:pb-0', columns)}>
          <TextField label={`${singular} ${k + 1}: moles in the reaction`} hideLabel inputMode="decimal" error={errorOf(`${side}.${k}.coef`)} {...register(`${side}.${k}.coef`)} />
          <TextField
            label={`${singular} ${k + 1}: formula`}
            hideLabel
            autoComplete="off"
            spellCheck={false}
            placeholder="e.g. CaO, Ca2+"
            containerClassName="col-span-3 sm:col-span-1"
            error={errorOf(`${side}.${k}.formula`)}
            {...register(`${side}.${k}.formula`)}
          />
          <SelectField label={`${singular} ${k + 1}: state`} hideLabel containerClassName="col-span-2 sm:col-span-1" error={errorOf(`${side}.${k}.phase`)} {...register(`${side}.${k}.phase`)}>
            <option value="">as written</option>
            {PHASES.map((p) => (
              <option key={p} value={p}>
                {phaseInWords(p)}
              </option>
            ))}
          </SelectField>
          {withMass ? (
            <TextField label={`${singular} ${k + 1}: grams in the pack`} hideLabel inputMode="decimal" placeholder="g" error={errorOf(`${side}.${k}.massG`)} {...register(`${side}.${k}.massG`)} />
          ) : null}
          <Button variant="ghost" size="sm" className="mt-1 justify-self-start" disabled={terms.fields.length <= 1} onClick={() => terms.remove(k)}>
            Remove<span className="sr-only"> {singular.toLowerCase()} {k + 1}</span>
          </Button>
        </div>
      ))}
      {sideError && (
        <p id={`${side}-error`} role="alert" className="text-caption font-semibold text-rust-600">
          {title} {sideError}
        </p>
      )}
      <Button variant="secondary" size="sm" className="self-start" onClick={() => terms.append({ formula: '', phase: '', coef: '1', massG: '' })}>
        Add a {singular.toLowerCase()}
      </Button>
    </fieldset>
  );
}
