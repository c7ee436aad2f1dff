import type { ReactNode } from 'react';
import type { BriefRecord } from '@shared/schemas/runs';
import { formatMoney, formatNumber, formatQuantity } from '@/lib/format';
import { CONTACT_NAMES, OBJECTIVE_NAMES, PACK_TYPE_NAMES, LOAD_KIND_NAMES } from './labels';

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div>
      <h3 className="text-caption font-bold tracking-wide text-ink-500 uppercase">{title}</h3>
      <dl className="mt-1.5 grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-1 text-small">{children}</dl>
    </div>
  );
}

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <>
      <dt className="text-ink-600">{label}</dt>
      <dd className="font-semibold tabular-nums text-ink-900">{children}</dd>
    </>
  );
}

/** A brief at a glance, every figure with its unit. */
export function BriefSummary({ brief, currency }: { brief: BriefRecord; currency: string }) {
  const s = brief.spec;
  const cold = s.packType === 'cold';
  const none = 'no limit';
  return (
    <div className="grid gap-5 sm:grid-cols-2 xl:grid-cols-3">
      <Group title="Thermal target">
        <Row label="Pack type">{PACK_TYPE_NAMES[s.packType]}</Row>
        <Row label="Target">
          {cold ? '≤' : '≥'} {formatQuantity(s.targetTempC, '°C')} within {formatQuantity(s.reachWithinMin, 'min')}
        </Row>
        <Row label="Band">
          {cold
            ? `up to ${formatQuantity(s.targetTempC + s.bandK, '°C')} (+${formatQuantity(s.bandK, 'K')})`
            : `down to ${formatQuantity(s.targetTempC - s.bandK, '°C')} (−${formatQuantity(s.bandK, 'K')})`}
        </Row>
        <Row label="Hold">{formatQuantity(s.holdMin, 'min')}</Row>
        <Row label="Ambient / initial">
          {formatQuantity(s.ambientC, '°C')} / {formatQuantity(s.initialTempC, '°C')}
        </Row>
      </Group>
      <Group title="Contact and limits">
        <Row label="Exchange">
          {s.uaWPerK !== null ? `UA ${formatQuantity(s.uaWPerK, 'W/K', 2)}` : CONTACT_NAMES[s.contact]}, {formatQuantity(s.packAreaM2, 'm²', 3)}
        </Row>
        <Row label="Pack mass">≤ {formatQuantity(s.maxMassG, 'g', 0)}</Row>
        <Row label="Unit cost">{s.maxUnitCost !== null ? `≤ ${formatMoney(s.maxUnitCost, currency)}` : none}</Row>
        <Row label="Surface">
          {s.minSurfaceTempC !== null ? `≥ ${formatQuantity(s.minSurfaceTempC, '°C')}` : 'no lower limit'}
          {' · '}
          {s.maxSurfaceTempC !== null ? `≤ ${formatQuantity(s.maxSurfaceTempC, '°C')}` : 'no upper limit'}
        </Row>
        <Row label="Gas">≤ {formatQuantity(s.maxGasL, 'L', 2)}</Row>
        <Row label="Serves">
          {s.load
            ? `${LOAD_KIND_NAMES[s.load.kind]}: ${formatQuantity(s.load.massG, 'g', 0)} at ${formatQuantity(s.load.cpJPerGK, 'J/(g·K)', 2)}, ${s.load.uaToPackWPerK !== null ? `UA ${formatQuantity(s.load.uaToPackWPerK, 'W/K', 2)}` : `${formatQuantity(s.load.contactAreaM2 ?? 0, 'm²', 3)} in contact`} (target and hold apply to it)`
            : 'the pack itself'}
        </Row>
      </Group>
      <Group title="Optimiser and packaging">
        <Row label="Objective">{OBJECTIVE_NAMES[s.objective]}</Row>
        <Row label="Actives">up to {formatNumber(s.maxActives)}</Row>
        <Row label="Incompatible mixtures">{s.allowIncompatible ? 'ranked among the others' : 'ranked after the compatible ones'}</Row>
        <Row label="Ingredients">
          {s.allowedIngredientIds.length ? `${s.allowedIngredientIds.length} allowed` : 'whole library'}
          {s.excludedIngredientIds.length ? `, ${s.excludedIngredientIds.length} excluded` : ''}
        </Row>
        <Row label="Hazard classes">{s.excludedHazardClasses.length ? s.excludedHazardClasses.join(', ') : 'none excluded'}</Row>
        <Row label="Packaging">
          {formatQuantity(s.packaging.massG, 'g')}, {formatQuantity(s.packaging.heatCapacityJPerK, 'J/K')}, {formatMoney(s.packaging.cost, currency)}
        </Row>
      </Group>
      {s.notes && (
        <p className="text-small whitespace-pre-line text-ink-700 sm:col-span-2 xl:col-span-3">
          <span className="font-semibold">Notes: </span>
          {s.notes}
        </p>
      )}
    </div>
  );
}
