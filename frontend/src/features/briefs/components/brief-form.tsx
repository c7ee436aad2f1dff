import { useState, type ReactNode } from 'react';
import { useForm, useWatch, type FieldPath, type UseFormReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { briefSchema, type LoadKind, type PackType } from '@shared/schemas/briefs';
import type { BriefRecord } from '@shared/schemas/runs';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { FormMessage, SelectField, TextField } from '@/components/ui/field';
import { isApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateBrief, useUpdateBrief } from '../api/save-brief';
import {
  BRIEF_FIELDS,
  briefValues,
  fieldSentence,
  moneyFrom,
  newBriefValues,
  newLoadValues,
  numberFrom,
  packTypeDefaults,
  type BriefFormInput,
  type BriefFormOutput,
} from './brief-form-values';
import { HazardClassList } from './hazard-class-list';
import { IngredientChoice } from './ingredient-choice';
import { CONTACT_NAMES, LOAD_KIND_NAMES, OBJECTIVE_NAMES, PACK_TYPE_NAMES } from './labels';

type Form = UseFormReturn<BriefFormInput, unknown, BriefFormOutput>;

const resolver = zodResolver(briefSchema);

/**
 * Creates or edits a brief, grouped as a designer thinks about it: the thermal target, how the
 * pack meets its surroundings, the limits, the ingredients, the optimiser and the packaging.
 * Validated in the browser with the very schema the server uses; the server's field errors are
 * placed beside their fields too.
 */
export function BriefForm({
  brief,
  currency,
  onSaved,
  onCancel,
  onReload,
}: {
  /** null: a new brief. */
  brief: BriefRecord | null;
  currency: string;
  onSaved: (saved: BriefRecord) => void;
  onCancel?: () => void;
  /** Fetches the latest version after a stale-edit refusal. */
  onReload?: () => Promise<BriefRecord | undefined>;
}) {
  const [formError, setFormError] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const form: Form = useForm<BriefFormInput, unknown, BriefFormOutput>({
    resolver,
    defaultValues: brief ? briefValues(brief.spec) : newBriefValues(),
    mode: 'onTouched',
  });
  const create = useCreateBrief();
  const update = useUpdateBrief();
  const saving = create.isPending || update.isPending;
  const packType = useWatch({ control: form.control, name: 'packType' }) as PackType;
  const allowedIds = (useWatch({ control: form.control, name: 'allowedIngredientIds' }) ?? []) as string[];
  const excludedIds = (useWatch({ control: form.control, name: 'excludedIngredientIds' }) ?? []) as string[];
  const hazardClasses = (useWatch({ control: form.control, name: 'excludedHazardClasses' }) ?? []) as string[];
  const [usesUa, setUsesUa] = useState(() => brief?.spec.uaWPerK !== null && brief?.spec.uaWPerK !== undefined);
  const cold = packType === 'cold';
  const load = useWatch({ control: form.control, name: 'load' }) as BriefFormInput['load'];
  const [loadByUa, setLoadByUa] = useState(() => brief?.spec.load?.uaToPackWPerK !== null && brief?.spec.load?.uaToPackWPerK !== undefined);

  const onError = (error: unknown) => {
    if (isApiError(error) && error.status === 409) {
      setStale(true);
      return;
    }
    setFormError(applyServerErrors(error, form.setError, BRIEF_FIELDS));
  };

  const onSubmit = form.handleSubmit(
    (values) => {
      setFormError(null);
      if (!brief) create.mutate(values, { onSuccess: onSaved, onError });
      else update.mutate({ id: brief.id, version: brief.version, ...values }, { onSuccess: onSaved, onError });
    },
    () => setFormError('Some fields need attention; see the messages beside them.'),
  );

  const reload = async () => {
    const latest = await onReload?.();
    if (latest) form.reset(briefValues(latest.spec));
    setStale(false);
    update.reset();
  };

  // A change of pack type brings that type's target and surface limits (common-practice defaults).
  const packTypeField = form.register('packType', {
    onChange: (event: { target: { value: string } }) => {
      const next = event.target.value === 'warm' ? 'warm' : 'cold';
      const d = packTypeDefaults(next);
      form.setValue('targetTempC', d.targetTempC, { shouldDirty: true });
      form.setValue('minSurfaceTempC', d.minSurfaceTempC, { shouldDirty: true });
      form.setValue('maxSurfaceTempC', d.maxSurfaceTempC, { shouldDirty: true });
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={brief ? `Edit ${brief.name}` : 'New brief'} className="flex flex-col gap-6">
      {stale && (
        <Alert
          tone="danger"
          title="Someone else changed this brief"
          action={
            <Button size="sm" variant="secondary" onClick={() => void reload()}>
              Reload their version
            </Button>
          }
        >
          It was saved by someone else while you were editing, so your changes were not saved. Reload to see the current
          version (your edits here will be replaced), then make your change again.
        </Alert>
      )}
      <FormMessage>{formError}</FormMessage>

      <fieldset disabled={saving} className="flex flex-col gap-6">
        <legend className="sr-only">Brief</legend>

        <Section title="Brief" description="A name the team will recognise, and anything worth knowing.">
          <div className="grid gap-4 sm:grid-cols-2">
            <Num form={form} name="name" label="Name" text />
          </div>
          <div className="flex flex-col gap-1.5">
            <label htmlFor="brief-notes" className="text-small font-semibold text-ink-800">
              Notes
            </label>
            <textarea
              id="brief-notes"
              rows={2}
              className="rounded-control border border-ink-200 bg-surface px-3 py-2 text-body"
              {...form.register('notes')}
            />
          </div>
        </Section>

        <Section title="Thermal target" description={cold ? 'How cold the pack must get, how fast, and for how long.' : 'How warm the pack must get, how fast, and for how long.'}>
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <SelectField label="Pack type" error={err(form, 'packType', 'Pack type')} {...packTypeField}>
              {(['cold', 'warm'] as const).map((t) => (
                <option key={t} value={t}>
                  {PACK_TYPE_NAMES[t]}
                </option>
              ))}
            </SelectField>
            <Num form={form} name="ambientC" label="Ambient temperature (°C)" />
            <Num form={form} name="initialTempC" label="Initial temperature (°C)" hint="Empty: the same as ambient." empty={undefined} />
            <Num
              form={form}
              name="targetTempC"
              label={cold ? 'Target, at most (≤ °C)' : 'Target, at least (≥ °C)'}
              hint={cold ? 'The pack gets down to this or colder.' : 'The pack gets up to this or warmer.'}
              empty={undefined}
            />
            <Num
              form={form}
              name="bandK"
              label="Band (K)"
              hint={cold ? 'How far above the target it may drift while held.' : 'How far below the target it may drift while held.'}
            />
            <Num form={form} name="reachWithinMin" label="Reach the target within (min)" />
            <Num form={form} name="holdMin" label="Hold in the band for (min)" />
          </div>
        </Section>

        <Section title="Contact" description="How the pack exchanges heat with what surrounds it.">
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <SelectField
              label="Heat exchange given by"
              value={usesUa ? 'ua' : 'case'}
              onChange={(e) => {
                const ua = e.target.value === 'ua';
                setUsesUa(ua);
                form.setValue('uaWPerK', ua ? (brief?.spec.uaWPerK ?? 1) : null, { shouldDirty: true, shouldValidate: true });
              }}
            >
              <option value="case">A contact case</option>
              <option value="ua">A known UA (W/K)</option>
            </SelectField>
            {usesUa ? (
              <Num form={form} name="uaWPerK" label="UA, overall conductance (W/K)" hint="0: no exchange (adiabatic)." empty={Number.NaN} />
            ) : (
              <SelectField label="Contact case" error={err(form, 'contact', 'Contact case')} {...form.register('contact')}>
                {(Object.keys(CONTACT_NAMES) as (keyof typeof CONTACT_NAMES)[]).map((c) => (
                  <option key={c} value={c}>
                    {CONTACT_NAMES[c]}
                  </option>
                ))}
              </SelectField>
            )}
            <Num form={form} name="packAreaM2" label="Pack area (m²)" hint="Outer area; 0.03 m² is both faces of a 15 × 10 cm pouch." />
          </div>
        </Section>

        <Section
          title="What the pack serves"
          description="A pack heats or cools something: a meal, a limb, a box's contents. With a load, the target and the hold apply to the load's temperature; the surface limits stay on the pack."
        >
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <SelectField
              label="The pack heats or cools"
              value={load?.kind ?? 'none'}
              onChange={(e) => {
                const kind = e.target.value;
                form.setValue('load', kind === 'none' ? null : newLoadValues(kind as LoadKind), { shouldDirty: true, shouldValidate: form.formState.isSubmitted });
                setLoadByUa(false);
              }}
            >
              <option value="none">Only itself (no load)</option>
              {(Object.keys(LOAD_KIND_NAMES) as LoadKind[]).map((k) => (
                <option key={k} value={k}>
                  {LOAD_KIND_NAMES[k]}
                </option>
              ))}
            </SelectField>
            {load && (
              <>
                <Num form={form} name="load.massG" label="Load mass (g)" hint="An 8-ounce entrée is 227 g." empty={Number.NaN} />
                <Num form={form} name="load.cpJPerGK" label="Load heat capacity (J/(g·K))" hint="Water 4.18; a wet meal about 3.6." empty={Number.NaN} />
                <Num form={form} name="load.initialTempC" label="Load start temperature (°C)" hint="Empty: the ambient temperature." empty={null} />
                <SelectField
                  label="Load coupled to the pack by"
                  value={loadByUa ? 'ua' : 'area'}
                  onChange={(e) => {
                    const ua = e.target.value === 'ua';
                    setLoadByUa(ua);
                    form.setValue('load.uaToPackWPerK', ua ? 1 : null, { shouldDirty: true });
                    form.setValue('load.contactAreaM2', ua ? null : 0.015, { shouldDirty: true });
                  }}
                >
                  <option value="area">A contact area</option>
                  <option value="ua">A known UA (W/K)</option>
                </SelectField>
                {loadByUa ? (
                  <Num form={form} name="load.uaToPackWPerK" label="UA, pack to load (W/K)" empty={Number.NaN} />
                ) : (
                  <Num form={form} name="load.contactAreaM2" label="Contact area, pack to load (m²)" hint="One face of a 15 × 10 cm pouch is 0.015 m²." empty={Number.NaN} />
                )}
                <Num form={form} name="load.uaToEnvWPerK" label="UA, load to its surroundings (W/K)" hint="0: the load is wrapped with the pack." empty={0} />
              </>
            )}
          </div>
        </Section>

        <Section title="Limits" description="What a candidate may not exceed.">
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <Num form={form} name="maxMassG" label="Pack mass, at most (g)" hint="Fill and packaging." />
            <Money form={form} name="maxUnitCost" label={`Unit cost, at most (${currency})`} hint="Fill and packaging; empty: no limit." empty={null} />
            <Num form={form} name="maxGasL" label="Gas evolved, at most (L at 25 °C)" hint="0 for a sealed pack." />
            <Num form={form} name="minSurfaceTempC" label="Coldest surface (°C)" hint="Empty: no limit." empty={null} />
            <Num form={form} name="maxSurfaceTempC" label="Warmest surface (°C)" hint="Empty: no limit." empty={null} />
          </div>
          <p className="text-caption text-ink-500">
            Warm packs default to at most 44 °C at the surface, where prolonged skin contact can start to burn; cold packs have
            no floor unless you set one (a medicine insert that must not freeze, say). For packs against skin, the hazard notes
            carry the cold-injury and burn cautions; local codes, the current safety data sheets and qualified review decide what
            is safe for the people who will use the pack.
          </p>
        </Section>

        <Section title="Ingredients" description="Which library ingredients the optimiser may use. None allowed means the whole library.">
          <IngredientChoice
            allowed={allowedIds}
            excluded={excludedIds}
            onChange={(allowed, excluded) => {
              form.setValue('allowedIngredientIds', allowed, { shouldDirty: true, shouldValidate: form.formState.isSubmitted });
              form.setValue('excludedIngredientIds', excluded, { shouldDirty: true, shouldValidate: form.formState.isSubmitted });
            }}
            error={err(form, 'excludedIngredientIds', 'Excluded ingredients') ?? err(form, 'allowedIngredientIds', 'Allowed ingredients')}
          />
          <HazardClassList
            value={hazardClasses}
            onChange={(classes) => form.setValue('excludedHazardClasses', classes, { shouldDirty: true, shouldValidate: true })}
            error={err(form, 'excludedHazardClasses', 'Excluded hazard classes')}
          />
        </Section>

        <Section title="Optimiser" description="What the optimiser makes best, and how many actives a mixture may combine.">
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <SelectField label="Objective" error={err(form, 'objective', 'Objective')} {...form.register('objective')}>
              {(Object.keys(OBJECTIVE_NAMES) as (keyof typeof OBJECTIVE_NAMES)[]).map((o) => (
                <option key={o} value={o}>
                  {OBJECTIVE_NAMES[o]}
                </option>
              ))}
            </SelectField>
            <SelectField
              label="Most active ingredients per mixture"
              error={err(form, 'maxActives', 'Most active ingredients')}
              {...form.register('maxActives', { valueAsNumber: true })}
            >
              {[1, 2, 3].map((n) => (
                <option key={n} value={n}>
                  {n}
                </option>
              ))}
            </SelectField>
          </div>
          <div>
            <label className="flex items-center gap-2 text-body text-ink-900">
              <input type="checkbox" className="size-4" aria-describedby="allow-incompatible-hint" {...form.register('allowIncompatible')} />
              Rank incompatible mixtures among the others
            </label>
            <p id="allow-incompatible-hint" className="mt-1 pl-6 text-caption text-ink-500">
              A mixture whose ingredients do not belong together (ions that precipitate, a gas from their meeting, an oxidiser
              with a fuel) is marked in the ranked table either way. Unticked, it ranks after every compatible one.
            </p>
          </div>
        </Section>

        <Section title="Packaging" description="Pouch, inner bag and anything else that is not an ingredient.">
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <Num form={form} name="packaging.massG" label="Packaging mass (g)" />
            <Num form={form} name="packaging.heatCapacityJPerK" label="Packaging heat capacity (J/K)" />
            <Money form={form} name="packaging.cost" label={`Packaging cost per unit (${currency})`} empty="" />
          </div>
        </Section>
      </fieldset>

      <div className="flex flex-wrap gap-3">
        <Button type="submit" pending={saving} pendingLabel="Saving…">
          {brief ? 'Save the brief' : 'Create the brief'}
        </Button>
        {onCancel && (
          <Button variant="secondary" onClick={onCancel} disabled={saving}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}

function Section({ title, description, children }: { title: string; description?: string; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-4 rounded-card border border-ink-100 px-4 pt-2 pb-4">
      <legend className="px-1 text-lead font-bold text-ink-900">{title}</legend>
      {description && <p className="-mt-2 text-small text-ink-500">{description}</p>}
      {children}
    </fieldset>
  );
}

/** The error of a field as a sentence, or undefined. */
function err(form: Form, name: FieldPath<BriefFormInput>, label: string): string | undefined {
  const message = form.getFieldState(name, form.formState).error?.message;
  return message ? fieldSentence(label, name, message) : undefined;
}

/** A number field (or, with `text`, a plain text field), its label carrying the unit. */
function Num({
  form,
  name,
  label,
  hint,
  empty = undefined,
  text = false,
  className,
}: {
  form: Form;
  name: FieldPath<BriefFormInput>;
  label: string;
  hint?: string;
  /** What an emptied field means: undefined (the default applies), null (no limit) or NaN (required). */
  empty?: undefined | null | number;
  text?: boolean;
  className?: string;
}) {
  const registered = text ? form.register(name) : form.register(name, { setValueAs: numberFrom(empty) });
  return (
    <TextField
      label={label}
      hint={hint}
      inputMode={text ? undefined : 'decimal'}
      autoComplete="off"
      containerClassName={cn(className)}
      error={err(form, name, label)}
      {...registered}
    />
  );
}

function Money({ form, name, label, hint, empty }: { form: Form; name: FieldPath<BriefFormInput>; label: string; hint?: string; empty: null | '' }) {
  return (
    <TextField
      label={label}
      hint={hint}
      inputMode="decimal"
      placeholder="0.45"
      autoComplete="off"
      error={err(form, name, label)}
      {...form.register(name, { setValueAs: moneyFrom(empty) })}
    />
  );
}
