import { useMemo } from 'react';
import { useFieldArray, useForm, useWatch, type UseFormRegister } from 'react-hook-form';
import type { ChemistryLibrary } from '@shared/chemistry';
import type { LoadKind } from '@shared/schemas/briefs';
import { formulaProcessOptions, type FormulaProcessOption } from '@shared/thermal';
import type { Ingredient } from '@shared/schemas/library';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { SelectField, TextField } from '@/components/ui/field';
import { QueryError } from '@/components/ui/query-error';
import { Loading, Spinner } from '@/components/ui/spinner';
import { errorMessage } from '@/lib/api-client';
import { formatNumber, formatQuantity, formatMoney } from '@/lib/format';
import { useEvaluateMixtureOnServer } from '../api/evaluate-mixture-on-server';
import { BLANK_COMPONENT, DEFAULT_BENCH, benchRequest, type BenchValues } from '../lib/bench-values';
import { useLiveEvaluation } from '../lib/use-live-evaluation';
import { BenchResults } from './bench-results';
import { ServerChecks } from './server-checks';

/** The loads a pack may serve, as the bench names them. */
const LOAD_KINDS: Record<LoadKind, string> = {
  'food-drink': 'A meal or a drink',
  'limb-through-fabric': 'A limb, through fabric',
  'cold-chain-box': 'A cold-chain box’s contents',
};

const EXCHANGES: { value: BenchValues['exchange']; label: string }[] = [
  { value: 'still-air', label: 'Still air (both faces)' },
  { value: 'skin-fabric', label: 'On skin, through fabric' },
  { value: 'insulated', label: 'Insulated (10 mm foam)' },
  { value: 'ua', label: 'Given UA (W/K)' },
];

const ROLE_ORDER = ['active', 'solvent', 'additive', 'packaging'] as const;

/**
 * The mixture bench: components and conditions on the left, the evaluation on the right, updated
 * as the user types by the shared `evaluateMixture` running in the browser.
 */
export function MixtureBench({ library, ingredients }: { library: ChemistryLibrary; ingredients: Ingredient[] }) {
  const form = useForm<BenchValues>({ defaultValues: DEFAULT_BENCH });
  const components = useFieldArray({ control: form.control, name: 'components' });
  const values = useWatch({ control: form.control }) as BenchValues;
  const valuesKey = JSON.stringify(values);
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const { request, errors, rows } = useMemo(() => benchRequest(values), [valuesKey]);
  const byId = useMemo(() => new Map(ingredients.map((i) => [i.id, i])), [ingredients]);
  const live = useLiveEvaluation(library, byId, request);
  const server = useEvaluateMixtureOnServer();

  // Errors the model raised, placed beside the component they concern.
  const modelErrors: Record<string, string> = {};
  if (live.state === 'failed') {
    for (const f of live.fields) {
      const m = /^components\.(\d+)\.?(.*)$/.exec(f.field);
      if (m) {
        const row = rows[Number(m[1])] ?? Number(m[1]);
        const part = m[2] === 'ingredientId' || m[2] === 'formula' ? m[2] : values.components[row]?.source === 'formula' ? 'formula' : 'ingredientId';
        modelErrors[`components.${row}.${part}`] = f.message;
      }
    }
  }
  const errorOf = (name: string) => errors[name] ?? modelErrors[name];
  const band = request?.targetBand ?? null;
  const ambientC = request?.ambientC ?? null;
  const hasAnyComponent = values.components.some((c) => c.ingredientId !== '' || c.formula.trim() !== '' || c.massG.trim() !== '');

  const grouped = ROLE_ORDER.map((role) => ({ role, items: ingredients.filter((i) => i.role === role) })).filter((g) => g.items.length > 0);

  return (
    <div className="grid grid-cols-1 items-start gap-gutter lg:grid-cols-[minmax(0,6fr)_minmax(0,7fr)]">
      <Card>
        <CardHeader title="Mixture" description="Components from the library or as a formula, then the conditions." />
        <CardBody>
          <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-5">
            <fieldset className="flex flex-col gap-3">
              <legend className="mb-2 text-small font-bold text-ink-900">Components</legend>
              <div aria-hidden="true" className="grid grid-cols-[7.25rem_minmax(0,1fr)_5rem_4.25rem] gap-2 text-caption font-semibold text-ink-600">
                <span>From</span>
                <span>Ingredient or formula</span>
                <span>Mass (g)</span>
              </div>
              {components.fields.map((field, k) => {
                const source = values.components[k]?.source ?? 'ingredient';
                return (
                  <div key={field.id} className="grid grid-cols-[7.25rem_minmax(0,1fr)_5rem_4.25rem] items-start gap-2 border-b border-ink-100 pb-3">
                    <SelectField label={`Component ${k + 1}: from`} hideLabel controlSize="md" {...form.register(`components.${k}.source`)}>
                      <option value="ingredient">Library</option>
                      <option value="formula">Formula</option>
                    </SelectField>
                    {source === 'ingredient' ? (
                      <SelectField
                        label={`Component ${k + 1}: ingredient`}
                        hideLabel
                        error={errorOf(`components.${k}.ingredientId`)}
                        {...form.register(`components.${k}.ingredientId`)}
                      >
                        <option value="">Choose…</option>
                        {grouped.map((g) => (
                          <optgroup key={g.role} label={g.role}>
                            {g.items.map((i) => (
                              <option key={i.id} value={i.id}>
                                {i.name}
                                {i.grade ? ` — ${i.grade}` : ''}
                              </option>
                            ))}
                          </optgroup>
                        ))}
                      </SelectField>
                    ) : (
                      <div className="flex flex-col gap-1">
                        <TextField
                          label={`Component ${k + 1}: formula`}
                          hideLabel
                          placeholder="NH4NO3, H2O, CaCl2·6H2O"
                          autoComplete="off"
                          spellCheck={false}
                          error={errorOf(`components.${k}.formula`)}
                          {...form.register(`components.${k}.formula`)}
                        />
                        <FormulaProcessChoice library={library} formula={values.components[k]?.formula ?? ''} index={k} register={form.register} />
                      </div>
                    )}
                    <TextField
                      label={`Component ${k + 1}: mass (g)`}
                      hideLabel
                      inputMode="decimal"
                      error={errorOf(`components.${k}.massG`)}
                      {...form.register(`components.${k}.massG`)}
                    />
                    <Button
                      variant="ghost"
                      size="sm"
                      className="mt-1"
                      disabled={components.fields.length <= 1}
                      onClick={() => components.remove(k)}
                    >
                      Remove<span className="sr-only"> component {k + 1}</span>
                    </Button>
                  </div>
                );
              })}
              <Button variant="secondary" size="sm" className="self-start" onClick={() => components.append({ ...BLANK_COMPONENT })}>
                Add a component
              </Button>
              {errors.components && <p className="text-caption font-semibold text-rust-600">{errors.components}</p>}
            </fieldset>

            <fieldset className="grid grid-cols-2 gap-3">
              <legend className="mb-2 text-small font-bold text-ink-900">Conditions</legend>
              <NumberField name="initialTempC" label="Initial temperature (°C)" register={form.register} error={errorOf('initialTempC')} />
              <NumberField name="ambientC" label="Ambient temperature (°C)" register={form.register} error={errorOf('ambientC')} />
              <SelectField label="Heat exchange" error={errorOf('exchange')} {...form.register('exchange')}>
                {EXCHANGES.map((e) => (
                  <option key={e.value} value={e.value}>
                    {e.label}
                  </option>
                ))}
              </SelectField>
              {values.exchange === 'ua' ? (
                <NumberField name="uaWPerK" label="UA (W/K)" hint="0 for adiabatic." register={form.register} error={errorOf('uaWPerK')} />
              ) : (
                <p className="self-end pb-2 text-caption text-ink-500">UA from the pack’s size and the contact case.</p>
              )}
              <NumberField
                name="packHeatCapacityJPerK"
                label="Pack heat capacity (J/K)"
                hint="Pouch and parts not listed; 0 for none."
                register={form.register}
                error={errorOf('packHeatCapacityJPerK')}
              />
              <NumberField name="holdMin" label="Hold time (min)" register={form.register} error={errorOf('holdMin')} />
              <NumberField name="bandMinC" label="Target band from (°C)" hint="Optional." register={form.register} error={errorOf('bandMinC')} />
              <NumberField name="bandMaxC" label="Target band to (°C)" register={form.register} error={errorOf('bandMaxC')} />
            </fieldset>

            <fieldset className="grid grid-cols-2 gap-3">
              <legend className="mb-2 text-small font-bold text-ink-900">What the pack heats or cools</legend>
              <SelectField label="Load" hint="With a load, the target band applies to it." error={errorOf('loadKind')} {...form.register('loadKind')}>
                <option value="none">None (the pack itself)</option>
                {(Object.keys(LOAD_KINDS) as LoadKind[]).map((k) => (
                  <option key={k} value={k}>
                    {LOAD_KINDS[k]}
                  </option>
                ))}
              </SelectField>
              {values.loadKind !== 'none' && (
                <>
                  <NumberField name="loadMassG" label="Load mass (g)" register={form.register} error={errorOf('loadMassG')} />
                  <NumberField name="loadCpJPerGK" label="Load heat capacity (J/(g·K))" hint="Water 4.18; a wet meal about 3.6." register={form.register} error={errorOf('loadCpJPerGK')} />
                  <NumberField name="loadInitialTempC" label="Load start temperature (°C)" hint="Empty: ambient." register={form.register} error={errorOf('loadInitialTempC')} />
                  <NumberField name="loadContactAreaM2" label="Contact area, pack to load (m²)" hint="Or give a UA instead." register={form.register} error={errorOf('loadContactAreaM2')} />
                  <NumberField name="loadUaToPackWPerK" label="UA, pack to load (W/K)" hint="Or a contact area." register={form.register} error={errorOf('loadUaToPackWPerK')} />
                  <NumberField name="loadUaToEnvWPerK" label="UA, load to surroundings (W/K)" hint="0: wrapped with the pack." register={form.register} error={errorOf('loadUaToEnvWPerK')} />
                </>
              )}
            </fieldset>
          </form>
        </CardBody>
      </Card>

      <Card>
        <CardHeader
          title="Evaluation"
          description="Computed in your browser as you type, with the same model the server runs."
          action={
            <div className="flex items-center gap-3">
              {(live.state === 'pending' || ('updating' in live && live.updating)) && (
                <span role="status" className="flex items-center gap-2 text-caption text-ink-500">
                  <Spinner size="sm" /> Updating…
                </span>
              )}
              {live.state === 'done' && !live.updating && (
                <span className="text-caption text-ink-500">computed in {formatNumber(live.elapsedMs, { maxFractionDigits: 0 })} ms</span>
              )}
              <Button
                variant="secondary"
                size="sm"
                disabled={!request}
                pending={server.isPending}
                pendingLabel="Checking…"
                onClick={() => request && server.mutate(request)}
              >
                Check on the server
              </Button>
            </div>
          }
        />
        <CardBody>
          <div aria-live="polite" className="flex flex-col gap-4">
            {server.isError && <Alert tone="danger" title="The server could not check this mixture">{errorMessage(server.error)}</Alert>}
            {server.isSuccess && (
              <>
                <Alert tone="info" title="Checked on the server" action={<Button size="sm" variant="ghost" onClick={() => server.reset()}>Dismiss</Button>}>
                  End {formatQuantity(server.data.endTempC, '°C', 2)}
                  {live.state === 'done' ? ` (browser: ${formatQuantity(live.result.endTempC, '°C', 2)})` : ''} · dissolved{' '}
                  {formatNumber(server.data.dissolvedFraction * 100, { maxFractionDigits: 1 })}&#8239;%
                  {server.data.cost ? ` · material cost ${formatMoney(server.data.cost.amount, server.data.cost.currency)}${server.data.cost.complete ? '' : ' (library ingredients only)'}` : ''}
                </Alert>
                <ServerChecks result={server.data} />
              </>
            )}
            {!hasAnyComponent ? (
              <EmptyState title="Add components to see the curve">
                Choose ingredients from the library or type formulas (for example NH4NO3 and H2O), with their masses in grams.
              </EmptyState>
            ) : live.state === 'failed' ? (
              <Alert tone="danger" title="The model could not evaluate this mixture">{live.message}</Alert>
            ) : !request ? (
              <Alert tone="caution" title="Complete the mixture">Fix the fields marked beside them; the evaluation follows at once.</Alert>
            ) : live.state === 'done' ? (
              <BenchResults result={live.result} precipitation={live.precipitation} band={band} ambientC={ambientC} />
            ) : (
              <Loading label="Evaluating…" />
            )}
          </div>
        </CardBody>
      </Card>
    </div>
  );
}

function NumberField({
  name,
  label,
  hint,
  error,
  register,
}: {
  name:
    | 'initialTempC'
    | 'ambientC'
    | 'uaWPerK'
    | 'packHeatCapacityJPerK'
    | 'holdMin'
    | 'bandMinC'
    | 'bandMaxC'
    | 'loadMassG'
    | 'loadCpJPerGK'
    | 'loadInitialTempC'
    | 'loadContactAreaM2'
    | 'loadUaToPackWPerK'
    | 'loadUaToEnvWPerK';
  label: string;
  hint?: string;
  error?: string;
  register: UseFormRegister<BenchValues>;
}) {
  return <TextField label={label} hint={hint} inputMode="decimal" autoComplete="off" error={error} {...register(name)} />;
}

/**
 * The process a bare formula gets (thermal/formula-process.ts): shown for the user to confirm, and
 * a choice where a chemist could mean more than one (sodium acetate trihydrate: dissolve, or a
 * supercooled melt).
 */
function FormulaProcessChoice({ library, formula, index, register }: { library: ChemistryLibrary; formula: string; index: number; register: UseFormRegister<BenchValues> }) {
  let options: FormulaProcessOption[] = [];
  try {
    options = formula.trim() ? formulaProcessOptions(library, formula.trim()) : [];
  } catch {
    options = []; // the formula field shows why it is not known
  }
  if (options.length === 0) return null;
  if (options.length === 1) return <p className="text-caption text-ink-500">Process: {options[0]!.label}</p>;
  return (
    <SelectField label={`Component ${index + 1}: process`} controlSize="md" {...register(`components.${index}.process`)}>
      {options.map((o, n) => (
        <option key={o.kind} value={n === 0 ? '' : o.kind}>
          {o.label}
        </option>
      ))}
    </SelectField>
  );
}

/** The bench with its data: the chemistry library (once) and the ingredient choices. */
export function MixtureBenchScreen({
  libraryQuery,
  ingredientsQuery,
}: {
  libraryQuery: { isPending: boolean; isError: boolean; error: unknown; data?: ChemistryLibrary; refetch: () => unknown; isFetching: boolean };
  ingredientsQuery: { isPending: boolean; isError: boolean; error: unknown; data?: { items: Ingredient[] }; refetch: () => unknown; isFetching: boolean };
}) {
  if (libraryQuery.isPending || ingredientsQuery.isPending) return <Loading label="Loading the chemistry data and the ingredient library…" />;
  if (libraryQuery.isError)
    return <QueryError title="The chemistry data could not be loaded" error={libraryQuery.error} onRetry={() => void libraryQuery.refetch()} retrying={libraryQuery.isFetching} />;
  if (ingredientsQuery.isError)
    return <QueryError title="The ingredient library could not be loaded" error={ingredientsQuery.error} onRetry={() => void ingredientsQuery.refetch()} retrying={ingredientsQuery.isFetching} />;
  return <MixtureBench library={libraryQuery.data!} ingredients={ingredientsQuery.data?.items ?? []} />;
}
