import { useMemo, type ReactNode } from 'react';
import { reactionAtTemperature } from '@shared/chemistry';
import { packCharge, runsUntriggered, type PackChargeResult } from '@shared/chemistry/pack-reaction';
import type { ReactionResponse } from '@shared/schemas/thermo';
import { LineChart, type ChartRule, type ChartSeries } from '@/components/charts/line-chart';
import { Alert } from '@/components/ui/alert';
import { cn } from '@/components/ui/cn';
import { Formula, phaseInWords } from '@/components/ui/formula';
import { formatNumber, formatQuantity } from '@/lib/format';
import { chargeByKey, num, packTerms, type ReactionValues } from './pack-terms';

/** J/g as a person reads it: kJ/g from 1000 J/g up. */
function perGram(j: number): string {
  return Math.abs(j) >= 1000 ? formatQuantity(j / 1000, 'kJ/g', 2) : formatQuantity(j, 'J/g', 0);
}

function heatText(j: number): string {
  return Math.abs(j) >= 1000 ? formatQuantity(Math.abs(j) / 1000, 'kJ', 1) : formatQuantity(Math.abs(j), 'J', 0);
}

/** Gases with a hazard beyond pressure (common practice, no source; the SDS governs). */
const GAS_CAUTIONS: Record<string, string> = {
  H2: 'Hydrogen is flammable: keep it away from flames and sparks and let it vent to open air.',
  NH3: 'Ammonia is toxic and irritating: vent away from the face.',
  CO: 'Carbon monoxide is toxic: do not use in a closed space.',
  Cl2: 'Chlorine is toxic: do not use this reaction in a consumer pack.',
  H2S: 'Hydrogen sulfide is toxic: do not use this reaction in a consumer pack.',
};

export function PackAnswers({ result, values, chargeValid, stale }: { result: ReactionResponse; values: ReactionValues; chargeValid: boolean; stale: boolean }) {
  const terms = useMemo(() => packTerms(result), [result]);
  const chargeG = chargeByKey(values, result, num);
  const waterRatio = num(values.waterRatio) ?? 0;
  const roomC = result.tempC;
  const pack: PackChargeResult | null =
    chargeG && chargeValid && Object.keys(chargeG).length > 0 && Number.isFinite(waterRatio)
      ? packCharge({ terms, dH_kJ: result.dH_kJ, chargeG, waterRatio_g_per_g: waterRatio, startTempC: roomC })
      : null;
  const runs = runsUntriggered(result.dG_kJ);
  const gives = result.dH_kJ < 0;
  const limiting = pack?.limitingKey ? result.terms.find((t) => t.key === pack.limitingKey) : undefined;
  const gasTerms = result.terms.filter((t) => t.phase === 'g');

  return (
    <div className={cn('flex flex-col gap-4 transition-opacity', stale && 'opacity-60')}>
      {!pack ? (
        <Alert tone="info" title="Give the reagents their grams">
          The heat, the temperature and the gas depend on how much goes in: enter grams for at least one reagent.
        </Alert>
      ) : (
        <dl className="grid grid-cols-1 gap-3 sm:grid-cols-2">
          <Answer
            tone={gives ? 'warm' : 'cool'}
            question={gives ? 'Heat given off by the charge' : 'Heat taken up by the charge'}
            answer={heatText(pack.heat_J)}
            detail={`${perGram(Math.abs(pack.heatPerFill_J_per_g))} of the whole fill (${formatQuantity(pack.fillG, 'g', 1)}, water included)`}
          />
          <Answer
            tone={gives ? 'warm' : 'cool'}
            question={
              <>
                Per gram of {limiting ? <Formula text={limiting.formula} /> : 'the limiting reagent'}
              </>
            }
            answer={pack.heatPerLimiting_J_per_g === null ? '—' : perGram(Math.abs(pack.heatPerLimiting_J_per_g))}
            detail={limiting ? <>It runs out first: {formatQuantity(pack.extent_mol, 'mol', 3)} of reaction.</> : undefined}
          />
          <Answer
            tone={pack.packTempC > 45 || pack.packTempC < 0 ? 'alert' : gives ? 'warm' : 'cool'}
            question="Pack temperature, no heat lost"
            answer={formatQuantity(pack.packTempC, '°C', 0)}
            detail={
              pack.boiledOffG > 0
                ? `Held at 100 °C while ${formatQuantity(pack.boiledOffG, 'g', 1)} of water boils off (${formatQuantity(pack.adiabaticDeltaT_K, 'K', 0)} rise without boiling).`
                : `${pack.adiabaticDeltaT_K >= 0 ? '+' : '−'}${formatQuantity(Math.abs(pack.adiabaticDeltaT_K), 'K', 1)} from ${formatQuantity(roomC, '°C', 0)} with ${formatQuantity(pack.waterG, 'g', 0)} of free water.`
            }
          />
          <Answer
            tone={pack.gas_mol > 0 ? 'alert' : 'neutral'}
            question="Gas at 1 atm and the pack temperature"
            answer={Math.abs(pack.gas_mol) < 1e-12 ? 'None' : formatQuantity(Math.abs(pack.gasVolumeL), 'L', 2)}
            detail={
              Math.abs(pack.gas_mol) < 1e-12
                ? 'No gas made or used: the pouch keeps its volume.'
                : pack.gas_mol > 0
                  ? `Given off: ${formatQuantity(pack.gas_mol, 'mol', 3)} as an ideal gas (V = nRT/p).`
                  : `Taken up, e.g. from air: ${formatQuantity(-pack.gas_mol, 'mol', 3)} as an ideal gas.`
            }
          />
        </dl>
      )}

      <div className={cn('rounded-card border-2 px-4 py-3', runs === 'yes' ? 'border-moss-100 bg-moss-50' : runs === 'no' ? 'border-amber-100 bg-amber-50' : 'border-ink-100 bg-ink-50')}>
        <p className="text-caption font-semibold uppercase tracking-wide text-ink-600">Starts on its own at {formatQuantity(roomC, '°C', 0)}?</p>
        <p className="mt-1 text-body font-bold text-ink-900">
          {runs === 'yes' && 'Yes — nothing needs to trigger it once the reagents meet.'}
          {runs === 'no' && 'No — at room temperature it will not run by itself.'}
          {runs === 'unknown' && 'Cannot tell — the species data lack an entropy.'}
        </p>
        <p className="mt-1 text-small text-ink-600">
          {runs === 'unknown'
            ? 'Without ΔS the free energy is unknown.'
            : `ΔG at ${formatQuantity(roomC, '°C', 0)} is ${formatQuantity(result.dG_kJ, 'kJ', 1)} per mole of reaction (standard states). How fast it runs — and whether it needs a catalyst, a seed or a breaking seal to start — is for the lab to show.`}
        </p>
      </div>

      {pack && <Cautions pack={pack} gasFormulas={gasTerms.filter((t) => t.nu > 0).map((t) => t.formula)} />}

      {pack && pack.missingCpKeys.length > 0 && (
        <Alert tone="caution" title="Heat capacity incomplete">
          No Cp° for {pack.missingCpKeys.join(', ')}; the temperature leaves them out and reads high.
        </Alert>
      )}
      {result.warnings.length > 0 && (
        <Alert tone="caution" title="About the data">
          <ul className="list-disc pl-4">
            {result.warnings.map((w, k) => (
              <li key={`${w.code}-${k}`}>{w.message}</li>
            ))}
          </ul>
        </Alert>
      )}

      <ThermoDetail result={result} />
    </div>
  );
}

function Answer({ question, answer, detail, tone }: { question: ReactNode; answer: string; detail?: ReactNode; tone: 'warm' | 'cool' | 'alert' | 'neutral' }) {
  const bar = { warm: 'border-l-ember-500', cool: 'border-l-frost-500', alert: 'border-l-rust-500', neutral: 'border-l-ink-300' }[tone];
  return (
    <div className={cn('rounded-control border border-l-4 border-ink-100 bg-surface px-4 py-3 shadow-card', bar)}>
      <dt className="text-small font-semibold text-ink-600">{question}</dt>
      <dd className="mt-0.5 text-title font-extrabold tabular-nums text-ink-950">{answer}</dd>
      {detail && <dd className="mt-1 text-caption text-ink-500">{detail}</dd>}
    </div>
  );
}

/** The usual cautions for what the numbers show; the SDS, local codes and licensed practice govern. */
function Cautions({ pack, gasFormulas }: { pack: PackChargeResult; gasFormulas: string[] }) {
  const items: string[] = [];
  if (pack.boiledOffG > 0) items.push('The water would boil: steam and a pouch at 100 °C scald. Add water, reduce the charge or slow the reaction.');
  else if (pack.packTempC > 45) items.push('Above about 44 °C long contact burns skin (common practice, no source): insulate the pack from the skin or reduce the charge.');
  if (pack.packTempC < 0) items.push('Below 0 °C a pack can cause cold injury: wrap it and limit contact time.');
  if (pack.gas_mol > 0) items.push('The pouch must vent or hold the gas volume shown without bursting.');
  for (const f of gasFormulas) if (GAS_CAUTIONS[f]) items.push(GAS_CAUTIONS[f]);
  if (items.length === 0) return null;
  return (
    <Alert tone="caution" title="Cautions">
      <ul className="list-disc pl-4">
        {items.map((t) => (
          <li key={t}>{t}</li>
        ))}
      </ul>
      <p className="mt-1">Follow the SDS of each reagent, local codes and licensed practice.</p>
    </Alert>
  );
}

/** ΔH, ΔS, ΔG and ΔG(T): the thermodynamics behind the answers, kept behind a disclosure. */
function ThermoDetail({ result }: { result: ReactionResponse }) {
  const { series, rules } = useMemo(() => dgCurves(result), [result]);
  const t = formatQuantity(result.tempC, '°C', 0);
  return (
    <details className="rounded-control border border-ink-100 bg-ink-50/40 px-4 py-3">
      <summary className="cursor-pointer text-small font-semibold text-ink-800">The thermodynamics behind it: ΔH, ΔS and ΔG against temperature</summary>
      <div className="mt-3 flex flex-col gap-4">
        <table className="w-full text-small">
          <caption className="sr-only">Reaction thermodynamics per mole of reaction as written</caption>
          <thead>
            <tr className="text-left text-caption text-ink-500">
              <th scope="col" className="py-1 font-semibold">Quantity</th>
              <th scope="col" className="py-1 text-right font-semibold">at 25 °C</th>
              <th scope="col" className="py-1 text-right font-semibold">at {t}</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            <tr className="border-t border-ink-100">
              <th scope="row" className="py-1 text-left font-semibold">ΔH</th>
              <td className="text-right">{formatQuantity(result.dH298_kJ, 'kJ', 2)}</td>
              <td className="text-right">{formatQuantity(result.dH_kJ, 'kJ', 2)}</td>
            </tr>
            <tr className="border-t border-ink-100">
              <th scope="row" className="py-1 text-left font-semibold">ΔS</th>
              <td className="text-right">{formatQuantity(result.dS298_J_per_K, 'J/K', 1)}</td>
              <td className="text-right">{formatQuantity(result.dS_J_per_K, 'J/K', 1)}</td>
            </tr>
            <tr className="border-t border-ink-100">
              <th scope="row" className="py-1 text-left font-semibold">ΔG</th>
              <td className="text-right">{formatQuantity(result.dG298_kJ, 'kJ', 2)}</td>
              <td className="text-right">{formatQuantity(result.dG_kJ, 'kJ', 2)}</td>
            </tr>
            <tr className="border-t border-ink-100">
              <th scope="row" className="py-1 text-left font-semibold">ΔCp</th>
              <td className="text-right">{formatQuantity(result.dCp_J_per_K, 'J/K', 1)}</td>
              <td className="text-right">—</td>
            </tr>
          </tbody>
        </table>
        <p className="text-small text-ink-700">
          {result.favourabilityText.charAt(0).toUpperCase() + result.favourabilityText.slice(1)}.
          {result.crossoverKirchhoffC !== null && ` With ΔCp the sign changes at ${formatQuantity(result.crossoverKirchhoffC, '°C', 0)}.`}
        </p>
        {series.length > 0 && (
          <LineChart
            title="ΔG against temperature"
            description="Below zero the reaction as written runs by itself (standard states)."
            series={series}
            rules={rules}
            height={220}
            x={{ label: 'Temperature', unit: '°C', format: (v) => formatNumber(v, { maxFractionDigits: 0 }) }}
            y={{ label: 'ΔG', unit: 'kJ', includeZero: true, format: (v) => formatNumber(v, { maxFractionDigits: 0 }) }}
            tableCaption="ΔG (kJ) against temperature (°C)"
          />
        )}
        <ul className="flex flex-col gap-1 text-caption text-ink-600">
          {result.terms.map((term) => (
            <li key={term.key}>
              <Formula text={term.formula} className="font-semibold text-ink-800" /> ({phaseInWords(term.phase)}, {term.name}, ν = {formatNumber(term.nu, { maxFractionDigits: 3 })}): {term.source}
            </li>
          ))}
        </ul>
      </div>
    </details>
  );
}

/** ΔG(T) with the Kirchhoff correction (reactionAtTemperature), over a range that shows any crossover. */
function dgCurves(result: ReactionResponse): { series: ChartSeries[]; rules: ChartRule[] } {
  if (result.dS298_J_per_K === null) return { series: [], rules: [] };
  const crossings = [result.crossoverC, result.crossoverKirchhoffC].filter((c): c is number => c !== null && c > -200 && c < 3000);
  const lo = Math.max(-200, Math.min(0, result.tempC - 25));
  const hi = Math.min(3000, Math.max(result.tempC + 100, 200, ...crossings.map((c) => c * 1.2 + 50)));
  const steps = 120;
  const temps = Array.from({ length: steps + 1 }, (_, k) => lo + ((hi - lo) * k) / steps);
  const series: ChartSeries[] = [
    {
      id: 'dg',
      label: result.dCp_J_per_K === null ? 'ΔG (constant ΔH°, ΔS°)' : 'ΔG (with ΔCp)',
      tone: 'ember',
      points: temps.map((tc) => ({ x: tc, y: reactionAtTemperature(result, tc).dG_kJ ?? Number.NaN })),
    },
  ];
  const rules: ChartRule[] = [{ axis: 'y', value: 0, label: 'ΔG = 0', tone: 'rust' }];
  // One labelled vertical line only, so labels cannot overlap: the crossover when in range, else room temperature.
  const cross = result.crossoverKirchhoffC ?? result.crossoverC;
  if (cross !== null && cross > lo && cross < hi) rules.push({ axis: 'x', value: cross, label: `sign change ${formatQuantity(cross, '°C', 0)}`, tone: 'rust' });
  else rules.push({ axis: 'x', value: result.tempC, label: 'room', tone: 'frost' });
  return { series, rules };
}
