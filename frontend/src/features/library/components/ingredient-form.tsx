import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { INGREDIENT_ROLES, type CreateIngredientRequest, type Ingredient } from '@shared/schemas/library';
import type { ProcessKind } from '@shared/thermal/process';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { FormMessage, SelectField, TextField, fieldErrorText } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateIngredient, useUpdateIngredient } from '../api/save-ingredient';
import { PROCESS_NAMES, ROLE_NAMES } from './labels';
import { PROCESS_TEMPLATES, formValuesFromIngredient, ingredientFormResolver, type IngredientFormValues } from './ingredient-form-values';

const FIELDS = ['name', 'grade', 'role', 'speciesKey', 'process', 'costPerKg', 'currency', 'densityGPerMl', 'cpJPerGK', 'sources', 'notes'] as const;

/**
 * Creates or edits an ingredient. Readers (designers, reviewers) see the same fields, disabled,
 * with no save button; the API refuses their writes anyway.
 */
export function IngredientForm({
  ingredient,
  currency,
  canWrite,
  onSaved,
  onReload,
}: {
  ingredient: Ingredient | null;
  /** The workspace's currency, the default for a new ingredient. */
  currency: string;
  canWrite: boolean;
  onSaved?: (saved: Ingredient) => void;
  /** Fetches the latest version after a stale-edit refusal. */
  onReload?: () => Promise<Ingredient | undefined>;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const [savedNote, setSavedNote] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const form = useForm<IngredientFormValues, unknown, CreateIngredientRequest>({
    resolver: ingredientFormResolver,
    defaultValues: formValuesFromIngredient(ingredient, currency),
  });
  const { errors, isDirty } = form.formState;
  const sources = useFieldArray({ control: form.control, name: 'sources' });
  const create = useCreateIngredient();
  const update = useUpdateIngredient();
  const saving = create.isPending || update.isPending;

  const onError = (error: unknown) => {
    if (isApiError(error) && error.status === 409) {
      setStale(true);
      return;
    }
    setFormError(applyServerErrors(error, form.setError, FIELDS));
  };

  const onSubmit = form.handleSubmit((values) => {
    setFormError(null);
    setSavedNote(null);
    if (!ingredient) {
      create.mutate(values, { onSuccess: (saved) => onSaved?.(saved), onError });
      return;
    }
    update.mutate(
      { id: ingredient.id, version: ingredient.version, ...values, grade: values.grade ?? '', speciesKey: values.speciesKey ?? null, process: values.process ?? null },
      {
        onSuccess: (saved) => {
          form.reset(formValuesFromIngredient(saved, currency));
          setSavedNote(`Saved as version ${saved.version}.`);
          onSaved?.(saved);
        },
        onError,
      },
    );
  });

  const reload = async () => {
    const latest = await onReload?.();
    if (latest) form.reset(formValuesFromIngredient(latest, currency));
    setStale(false);
    update.reset();
  };

  const chooseTemplate = (kind: ProcessKind) =>
    form.setValue('process', JSON.stringify(PROCESS_TEMPLATES[kind], null, 2), { shouldDirty: true, shouldValidate: true });

  const processError = errors.process?.message;
  const sourcesError = errors.sources?.message ?? errors.sources?.root?.message;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5" aria-label={ingredient ? `Edit ${ingredient.name}` : 'New ingredient'}>
      {stale && (
        <Alert
          tone="danger"
          title="Someone else changed this ingredient"
          action={
            <Button size="sm" variant="secondary" onClick={() => void reload()}>
              Reload their version
            </Button>
          }
        >
          It was saved by someone else while you were editing, so your changes were not saved. Reload to see the
          current version (your edits here will be replaced), then make your change again.
        </Alert>
      )}
      <FormMessage>{formError}</FormMessage>
      {savedNote && !isDirty && <FormMessage tone="success">{savedNote}</FormMessage>}
      {!canWrite && (
        <Alert tone="info">Your role reads the library; chemists and administrators change it.</Alert>
      )}

      <fieldset disabled={!canWrite || saving} className="flex flex-col gap-5">
        <legend className="sr-only">Ingredient</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField label="Name" error={errors.name?.message} {...form.register('name')} />
          <TextField label="Grade" hint="Form, purity or supplier grade." error={errors.grade?.message} {...form.register('grade')} />
          <SelectField label="Role" error={errors.role?.message} {...form.register('role')}>
            {INGREDIENT_ROLES.map((role) => (
              <option key={role} value={role}>
                {ROLE_NAMES[role]}
              </option>
            ))}
          </SelectField>
          <TextField
            label="Species key"
            hint="Formula and phase, e.g. NH4NO3(cr); leave empty for a mixture."
            error={errors.speciesKey?.message}
            {...form.register('speciesKey')}
          />
          <div className="grid grid-cols-[minmax(0,1fr)_6rem] gap-3">
            <TextField label="Cost per kg" inputMode="decimal" placeholder="12.50" error={errors.costPerKg?.message} {...form.register('costPerKg')} />
            <TextField label="Currency" maxLength={3} autoCapitalize="characters" error={errors.currency?.message} {...form.register('currency')} />
          </div>
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Density (g/mL)" inputMode="decimal" error={errors.densityGPerMl?.message} {...form.register('densityGPerMl')} />
            <TextField
              label="Specific heat (J/(g·K))"
              inputMode="decimal"
              hint="For inert items."
              error={errors.cpJPerGK?.message}
              {...form.register('cpJPerGK')}
            />
          </div>
        </div>

        <ProcessField
          error={processError}
          register={form.register('process')}
          onTemplate={chooseTemplate}
          canWrite={canWrite}
        />

        <fieldset className="flex flex-col gap-2">
          <legend className="text-small font-semibold text-ink-800">Sources</legend>
          <p className="text-caption text-ink-500">Cite where each figure comes from: handbook and edition, data sheet, or "from memory".</p>
          {sourcesError && <p className="text-caption font-semibold text-rust-600">{fieldErrorText('Sources', sourcesError)}</p>}
          <ol className="flex flex-col gap-2">
            {sources.fields.map((field, k) => (
              <li key={field.id} className="flex items-start gap-2">
                <TextField
                  label={`Source ${k + 1}`}
                  hideLabel
                  containerClassName="flex-1"
                  error={errors.sources?.[k]?.value?.message}
                  {...form.register(`sources.${k}.value`)}
                />
                {canWrite && (
                  <Button variant="ghost" size="sm" className="mt-1" onClick={() => sources.remove(k)}>
                    Remove<span className="sr-only"> source {k + 1}</span>
                  </Button>
                )}
              </li>
            ))}
          </ol>
          {sources.fields.length === 0 && <p className="text-small text-amber-700">No source cited yet.</p>}
          {canWrite && (
            <Button variant="secondary" size="sm" className="self-start" onClick={() => sources.append({ value: '' })}>
              Add a source
            </Button>
          )}
        </fieldset>

        <div className="flex flex-col gap-1.5">
          <label htmlFor="ingredient-notes" className="text-small font-semibold text-ink-800">
            Notes
          </label>
          <textarea
            id="ingredient-notes"
            rows={3}
            className="rounded-control border border-ink-200 bg-surface px-3 py-2 text-body disabled:bg-ink-50 disabled:text-ink-500"
            aria-invalid={errors.notes ? true : undefined}
            {...form.register('notes')}
          />
          {errors.notes?.message && <p className="text-caption font-semibold text-rust-600">{fieldErrorText('Notes', errors.notes.message)}</p>}
        </div>
      </fieldset>

      {canWrite && (
        <div className="flex flex-wrap gap-3">
          <Button type="submit" pending={saving} pendingLabel="Saving…" disabled={!!ingredient && !isDirty}>
            {ingredient ? 'Save changes' : 'Add to the library'}
          </Button>
          {ingredient && isDirty && (
            <Button variant="ghost" onClick={() => form.reset(formValuesFromIngredient(ingredient, currency))}>
              Discard changes
            </Button>
          )}
        </div>
      )}
    </form>
  );
}

function ProcessField({
  error,
  register,
  onTemplate,
  canWrite,
}: {
  error?: string;
  register: ReturnType<ReturnType<typeof useForm<IngredientFormValues>>['register']>;
  onTemplate: (kind: ProcessKind) => void;
  canWrite: boolean;
}) {
  return (
    <div className="flex flex-col gap-1.5">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <label htmlFor="ingredient-process" className="text-small font-semibold text-ink-800">
          Heat-producing process (JSON)
        </label>
        {canWrite && (
          <SelectField
            label="Start from a template"
            controlSize="sm"
            containerClassName="w-60"
            value=""
            onChange={(event) => {
              const kind = event.target.value as ProcessKind;
              if (kind) onTemplate(kind);
            }}
          >
            <option value="">Choose a process kind…</option>
            {(Object.keys(PROCESS_NAMES) as ProcessKind[]).map((kind) => (
              <option key={kind} value={kind}>
                {PROCESS_NAMES[kind]}
              </option>
            ))}
          </SelectField>
        )}
      </div>
      <textarea
        id="ingredient-process"
        rows={8}
        spellCheck={false}
        aria-invalid={error ? true : undefined}
        aria-describedby="ingredient-process-help"
        className={cn(
          'rounded-control border bg-surface px-3 py-2 font-mono text-small disabled:bg-ink-50 disabled:text-ink-500',
          error ? 'border-rust-500' : 'border-ink-200',
        )}
        {...register}
      />
      <p id="ingredient-process-help" className={cn('text-caption', error ? 'font-semibold text-rust-600' : 'text-ink-500')}>
        {error
          ? fieldErrorText('The process', error)
          : 'Checked with the thermal model’s process schema. Species keys are formula(phase), e.g. NH4NO3(cr); empty for none.'}
      </p>
    </div>
  );
}
