import type { PrecipitationResult } from '@shared/chemistry';
import type { EvaluateMixtureResponse } from '@shared/schemas/mixtures';
import { LineChart, type ChartBand, type ChartRule, type ChartSeries } from '@/components/charts/line-chart';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { formatNumber, formatQuantity } from '@/lib/format';

const LIMIT_TEXT = {
  none: 'fully dissolved',
  solubility: 'limited by solubility',
  ice: 'limited by ice',
} as const;

/** Common first-aid practice (not a regulatory limit): no bare-skin contact below 0 °C or, for long holds, above about 44 °C. */
const COLD_CONTACT_C = 0;
const HOT_CONTACT_C = 44;

function Figure({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="rounded-control border border-ink-100 bg-ink-50/50 px-3 py-2">
      <dt className="text-caption font-semibold text-ink-500">{label}</dt>
      <dd className="text-title font-extrabold tabular-nums text-ink-950">{value}</dd>
      {note && <dd className="text-caption text-ink-500">{note}</dd>}
    </div>
  );
}

const kJ = (joules: number) => formatQuantity(joules / 1000, 'kJ', 2);

export function BenchResults({
  result,
  precipitation,
  band,
  ambientC,
}: {
  result: EvaluateMixtureResponse;
  precipitation?: PrecipitationResult;
  band: { minC: number; maxC: number } | null;
  ambientC: number | null;
}) {
  const startC = result.curve[0]?.tempC ?? result.endTempC;
  // A cold pack falls from its start; a warm one rises.
  const cooling = startC - result.minTempC >= result.maxTempC - startC;
  const series: ChartSeries[] = [
    { id: 'pack', label: 'Pack temperature', tone: cooling ? 'frost' : 'ember', points: result.curve.map((p) => ({ x: p.tMin, y: p.tempC })) },
    // The load the pack serves; the target band is judged on it.
    ...(result.load ? [{ id: 'load', label: 'Load temperature', tone: 'ink' as const, dashed: true, points: result.load.curve.map((p) => ({ x: p.tMin, y: p.tempC })) }] : []),
  ];
  const bands: ChartBand[] = band ? [{ from: band.minC, to: band.maxC, label: 'Target band', tone: 'moss' }] : [];
  const rules: ChartRule[] = ambientC !== null ? [{ axis: 'y', value: ambientC, label: `Ambient ${formatQuantity(ambientC, '°C')}`, tone: 'ink' }] : [];
  const limited = result.solutes.filter((s) => s.limitedBy !== 'none');
  const minutes = (v: number | null) => (v === null ? '—' : formatQuantity(v, 'min', 1));

  return (
    <div className="flex flex-col gap-5">
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <Figure label="End temperature" value={formatQuantity(result.endTempC, '°C')} note="at the end of the hold" />
        {result.load && (
          <Figure
            label="Load at the end"
            value={formatQuantity(result.load.endTempC, '°C')}
            note={`warmest ${formatQuantity(result.load.maxTempC, '°C')}, coldest ${formatQuantity(result.load.minTempC, '°C')}; the target band is judged on the load`}
          />
        )}
        <Figure
          label={cooling ? 'Lowest temperature' : 'Highest temperature'}
          value={formatQuantity(cooling ? result.minTempC : result.maxTempC, '°C')}
        />
        <Figure
          label="Dissolved"
          value={`${formatNumber(result.dissolvedFraction * 100, { maxFractionDigits: 0 })}\u202f%`}
          note={limited.length ? limited.map((s) => `${s.key}: ${LIMIT_TEXT[s.limitedBy]}`).join('; ') : 'of the dissolving solids'}
        />
        <Figure
          label="Minutes in the band"
          value={band ? minutes(result.minutesInBand) : '—'}
          note={band ? (result.timeToTargetMin !== null ? `target reached after ${minutes(result.timeToTargetMin)}` : `of the ${formatQuantity(result.curve.at(-1)?.tMin ?? 0, 'min', 0)} hold`) : 'set a target band'}
        />
      </dl>

      <LineChart
        title="Pack temperature over the hold"
        description="The lumped-capacitance time profile of the mixture."
        series={series}
        bands={bands}
        rules={rules}
        x={{ label: 'Time', unit: 'min', format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
        y={{ label: 'Temperature', unit: '°C', format: (v) => formatNumber(v, { maxFractionDigits: 1 }) }}
        tableCaption="Pack temperature (°C) against time (min)"
      />

      {result.solutes.length > 0 && (
        <table className="w-full text-left text-small">
          <caption className="mb-1 text-left text-small font-bold text-ink-900">Dissolving solids</caption>
          <thead className="text-caption font-bold text-ink-500">
            <tr>
              <th scope="col" className="py-1 pr-3">Component</th>
              <th scope="col" className="py-1 pr-3 text-right">Dissolved (%)</th>
              <th scope="col" className="py-1">Limited by</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100">
            {result.solutes.map((s) => (
              <tr key={s.key}>
                <th scope="row" className="py-1.5 pr-3 font-semibold">{s.key}</th>
                <td className="py-1.5 pr-3 text-right tabular-nums">{formatNumber(s.dissolvedFraction * 100, { maxFractionDigits: 1 })}</td>
                <td className="py-1.5">
                  <Badge tone={s.limitedBy === 'none' ? 'success' : 'caution'}>{LIMIT_TEXT[s.limitedBy]}</Badge>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {precipitation && precipitation.precipitates.length > 0 && (
        <Alert tone="caution" title="A solid precipitates">
          {precipitation.statement} The curve above does not include this solid or its heat yet; the salts do not stay dissolved as designed.
        </Alert>
      )}
      {result.iceG > 0.01 && <Alert tone="caution">About {formatQuantity(result.iceG, 'g')} of ice forms: the pack sits on its freezing line.</Alert>}

      <table className="w-full text-left text-small">
        <caption className="mb-1 text-left text-small font-bold text-ink-900">Energy over the hold (kJ)</caption>
        <tbody className="divide-y divide-ink-100 tabular-nums">
          {result.energy.processes.filter((p) => Math.abs(p.heatReleasedJ) >= 0.5).map((p) => (
            <tr key={`p-${p.label}`}>
              <th scope="row" className="py-1.5 pr-3 font-normal">
                {p.label} <span className="text-ink-500">({p.kind})</span>
              </th>
              <td className="py-1.5 text-right">{kJ(p.heatReleasedJ)}</td>
            </tr>
          ))}
          <tr>
            <th scope="row" className="py-1.5 pr-3 font-semibold">Heat released by the processes <span className="font-normal text-ink-500">(− absorbed)</span></th>
            <td className="py-1.5 text-right font-semibold">{kJ(result.energy.heatReleasedJ)}</td>
          </tr>
          <tr>
            <th scope="row" className="py-1.5 pr-3 font-normal">Heat stored in the pack, sensible <span className="text-ink-500">(− the pack cooled)</span></th>
            <td className="py-1.5 text-right">{kJ(result.energy.heatStoredJ)}</td>
          </tr>
          <tr>
            <th scope="row" className="py-1.5 pr-3 font-normal">Heat lost to the surroundings <span className="text-ink-500">(− gained from them)</span></th>
            <td className="py-1.5 text-right">{kJ(result.energy.heatLostJ)}</td>
          </tr>
          <tr>
            <th scope="row" className="py-1.5 pr-3 font-normal text-ink-500">Balance error (relative)</th>
            <td className="py-1.5 text-right text-ink-500">{formatNumber(result.energy.relativeBalanceError * 100, { maxFractionDigits: 3 })}&#8239;%</td>
          </tr>
        </tbody>
      </table>
      <p className="-mt-3 text-caption text-ink-500">
        Adiabatic end state: {formatQuantity(result.adiabaticEndTempC, '°C')} · UA {formatQuantity(result.uaWPerK, 'W/K', 3)} to{' '}
        {formatQuantity(result.envTempC, '°C')}
        {result.areaM2 !== null ? ` · pack area ${formatQuantity(result.areaM2 * 1e4, 'cm²', 0)}` : ''} · total {formatQuantity(result.massG, 'g')}
      </p>

      {result.warnings.length > 0 && (
        <Alert tone="caution" title="Model warnings">
          <ul className="list-disc pl-4">
            {result.warnings.map((w, k) => (
              <li key={`${w.code}-${k}`}>{w.message}</li>
            ))}
          </ul>
        </Alert>
      )}

      {(result.minTempC < COLD_CONTACT_C || result.maxTempC > HOT_CONTACT_C) && (
        <Alert tone="caution" title="Skin contact">
          The pack reaches {result.minTempC < COLD_CONTACT_C ? formatQuantity(result.minTempC, '°C') : formatQuantity(result.maxTempC, '°C')}. Below
          0 °C or above about 44 °C, contact with bare skin can injure within the hold; common practice is a fabric layer and a
          limited contact time.
        </Alert>
      )}
      <p className="text-caption text-ink-500">
        These figures come from a model and are informational. Local codes, the ingredients’ current safety data sheets and
        qualified review decide what is safe to make, ship and use.
      </p>
    </div>
  );
}
