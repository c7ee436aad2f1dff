import { useState } from 'react';
import { LineChart } from '@/components/charts/line-chart';
import { Alert } from '@/components/ui/alert';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { SelectField } from '@/components/ui/field';
import { Loading } from '@/components/ui/spinner';
import { QueryError } from '@/components/ui/query-error';
import { errorMessage } from '@/lib/api-client';
import { useApplyCalibration, useCalibrations, useFitLabLog, useLabLog, useMixtureIngredients, type StoredFit } from '../api/lab-logs';

const f2 = (x: number) => (Number.isFinite(x) ? x.toFixed(2) : '—');
const f3 = (x: number) => (Number.isFinite(x) ? x.toPrecision(3) : '—');

function Stat({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded-control border border-ink-100 px-3 py-2">
      <dt className="text-caption text-ink-500">{label}</dt>
      <dd className="text-lead font-bold tabular-nums text-ink-900">{value}</dd>
    </div>
  );
}

/**
 * One lab log: measured against predicted (and fitted, once fitted) with the residuals beneath,
 * RMSE and minutes in band; the fit of UA, enthalpy factor and rate constant with standard
 * errors; applying the fit to a contact case or an ingredient (chemists and admins).
 */
export function LabLogDetail({ id, canCalibrate }: { id: number; canCalibrate: boolean }) {
  const q = useLabLog(id);
  const fit = useFitLabLog(id);
  if (q.isPending) return <Loading label="Loading the lab log…" />;
  if (q.isError) return <QueryError error={q.error} onRetry={() => void q.refetch()} />;
  const d = q.data;
  const ch = d.labLog.conditions.channel ?? 0;
  const measured = d.samples.map((s) => ({ x: s[0]! / 60, y: s[1 + ch]! }));
  const pred = d.predicted.overlay;
  const fitted = d.fitted?.overlay ?? null;
  const storedFit = d.labLog.fit;

  return (
    <div className="flex flex-col gap-6">
      <Card>
        <CardHeader
          title="Measured against predicted"
          description={`${d.labLog.sampleCount.toLocaleString('en')} samples of “${d.labLog.channels[ch]}” from ${d.labLog.filename}; ${d.labLog.conditions.contact.replaceAll('-', ' ')}, ambient ${d.labLog.conditions.ambientC} °C.`}
        />
        <CardBody className="flex flex-col gap-4">
          {d.predicted.error && <Alert tone="danger" title="The model could not run this mixture">{d.predicted.error}</Alert>}
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <Stat label="RMSE, model as is" value={`${f2(pred.rmseK)} K`} />
            <Stat label="Mean residual (measured − predicted)" value={`${f2(pred.biasK)} K`} />
            {fitted && <Stat label="RMSE after the fit" value={`${f2(fitted.rmseK)} K`} />}
            {pred.minutesInBand && (
              <Stat label={`Minutes in ${f2(d.band!.minC)}–${f2(d.band!.maxC)} °C, measured / predicted`} value={`${f2(pred.minutesInBand.measured)} / ${f2(pred.minutesInBand.predicted)}`} />
            )}
          </dl>
          <LineChart
            title="Temperature of the pack"
            description="Measured readings, the model's prediction for the same mixture and conditions, and the fitted model once fitted."
            x={{ label: 'Time', unit: 'min' }}
            y={{ label: 'Temperature', unit: '°C' }}
            bands={d.band ? [{ from: Math.max(d.band.minC, -40), to: Math.min(d.band.maxC, 120), label: `Brief’s band${d.briefName ? ` (${d.briefName})` : ''}`, tone: 'moss' }] : []}
            series={[
              // Measured last, so it draws over the model curves it is compared with.
              { id: 'predicted', label: 'Predicted', tone: 'frost', dashed: true, points: d.predicted.curve.map((p) => ({ x: p.tMin, y: p.tempC })) },
              ...(d.fitted ? [{ id: 'fitted', label: 'Fitted model', tone: 'ember' as const, dashed: true, points: d.fitted.curve.map((p) => ({ x: p.tMin, y: p.tempC })) }] : []),
              { id: 'measured', label: 'Measured', tone: 'ink', points: measured },
            ]}
          />
          <LineChart
            title="Residuals (measured − predicted)"
            height={180}
            x={{ label: 'Time', unit: 'min' }}
            y={{ label: 'Residual', unit: 'K', includeZero: true }}
            rules={[{ axis: 'y', value: 0, label: '0' }]}
            series={[
              { id: 'res', label: 'Model as is', tone: 'frost', points: pred.points.map((p) => ({ x: p.tMin, y: p.residualK })) },
              ...(fitted ? [{ id: 'res-fit', label: 'Fitted model', tone: 'ember' as const, points: fitted.points.map((p) => ({ x: p.tMin, y: p.residualK })) }] : []),
            ]}
          />
        </CardBody>
      </Card>

      <Card>
        <CardHeader
          title="Calibration"
          description="Least-squares fit of the model to this log: the heat-transfer coefficient UA, an effective enthalpy factor and the rate constant of the mixture's processes."
          action={
            canCalibrate ? (
              <Button onClick={() => fit.mutate(['ua', 'enthalpy', 'rate'])} pending={fit.isPending} variant={storedFit ? 'secondary' : 'primary'}>
                {storedFit ? 'Fit again' : 'Fit the model'}
              </Button>
            ) : undefined
          }
        />
        <CardBody className="flex flex-col gap-4">
          {fit.isError && <Alert tone="danger" title="The fit did not run">{errorMessage(fit.error)}</Alert>}
          {storedFit ? <FitResults fit={storedFit} /> : <p className="text-small text-ink-500">Not fitted yet.{canCalibrate ? '' : ' A chemist fits and applies calibrations.'}</p>}
          {storedFit && canCalibrate && <ApplyCalibration labLogId={id} fit={storedFit} contact={d.labLog.conditions.contact} componentKeys={d.labLog.scenario.components.map((c) => c.key)} />}
        </CardBody>
      </Card>
    </div>
  );
}

function FitResults({ fit }: { fit: StoredFit }) {
  const rows = [
    { name: 'UA multiplier (measured ÷ modelled exchange)', v: fit.uaMultiplier, unit: '', on: fit.fitted.includes('ua') },
    { name: 'UA', v: fit.uaWPerK, unit: 'W/K', on: fit.fitted.includes('ua') },
    { name: 'Effective enthalpy factor', v: fit.enthalpyFactor, unit: '', on: fit.fitted.includes('enthalpy') },
    ...(fit.rateConstantPerMin ? [{ name: 'Rate constant', v: fit.rateConstantPerMin, unit: '1/min', on: fit.fitted.includes('rate') }] : []),
  ].filter((r) => r.on);
  return (
    <div className="flex flex-col gap-3">
      <table className="w-full max-w-2xl text-left text-small tabular-nums">
        <caption className="sr-only">Fitted values</caption>
        <thead className="text-caption font-bold text-ink-600">
          <tr>
            <th scope="col" className="py-1 pr-4">Parameter</th>
            <th scope="col" className="py-1 pr-4">Fitted</th>
            <th scope="col" className="py-1 pr-4">Standard error</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100">
          {rows.map((r) => (
            <tr key={r.name}>
              <th scope="row" className="py-1 pr-4 font-semibold text-ink-800">{r.name}</th>
              <td className="py-1 pr-4">{f3(r.v.value)} {r.unit}</td>
              <td className="py-1 pr-4">± {f3(r.v.standardError)} {r.unit}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="flex flex-wrap gap-2 text-small text-ink-700">
        <Badge tone={fit.rmseK < 0.5 ? 'success' : fit.rmseK < 1.5 ? 'caution' : 'danger'}>RMSE {f2(fit.rmseK)} K (was {f2(fit.nominalRmseK)} K)</Badge>
        <Badge>R² {fit.rSquared.toFixed(4)}</Badge>
        <Badge>{fit.points} points, {fit.iterations} iterations, {Math.round(fit.elapsedMs)} ms</Badge>
      </p>
      {fit.warnings.map((w) => (
        <Alert key={w} tone="caution">{w}</Alert>
      ))}
      <p className="text-caption text-ink-500">Method: {fit.method}. Fitted by {fit.fittedBy}.</p>
    </div>
  );
}

function ApplyCalibration({ labLogId, fit, contact, componentKeys }: { labLogId: number; fit: StoredFit; contact: string; componentKeys: string[] }) {
  const apply = useApplyCalibration();
  const calibrations = useCalibrations();
  const ingredients = useMixtureIngredients();
  const inMixture = (ingredients.data?.items ?? []).filter((i) => componentKeys.includes(String(i.id)) && i.role === 'active');
  const [target, setTarget] = useState<string>('contact');
  const mine = (calibrations.data?.items ?? []).filter((c) => c.labLogId === labLogId && c.active);
  const submit = () => {
    if (target === 'contact') apply.mutate({ labLogId, scope: 'contact' });
    else apply.mutate({ labLogId, scope: 'ingredient', ingredientId: Number(target) });
  };
  return (
    <section aria-labelledby="apply-cal" className="flex flex-col gap-3 border-t border-ink-100 pt-4">
      <h3 id="apply-cal" className="text-small font-bold text-ink-900">Apply this calibration</h3>
      <p className="text-caption text-ink-500">Later runs use it and record it in their data snapshot. The contact case takes the UA multiplier; an ingredient takes the rate constant and the enthalpy factor.</p>
      <div className="flex flex-wrap items-end gap-3">
        <SelectField label="Apply to" value={target} onChange={(e) => setTarget(e.currentTarget.value)}>
          {fit.fitted.includes('ua') && <option value="contact">Contact case: {contact.replaceAll('-', ' ')} (UA × {f3(fit.uaMultiplier.value)})</option>}
          {inMixture.map((i) => (
            <option key={i.id} value={String(i.id)}>
              Ingredient: {i.name}
            </option>
          ))}
        </SelectField>
        <Button onClick={submit} pending={apply.isPending}>
          Apply calibration
        </Button>
      </div>
      {apply.isError && <Alert tone="danger">{errorMessage(apply.error)}</Alert>}
      {apply.isSuccess && <Alert tone="success">Applied: {apply.data.calibration.scope === 'contact' ? `UA of ${apply.data.calibration.contactCase} × ${f3(apply.data.calibration.parameters.uaMultiplier ?? 1)}` : `${apply.data.calibration.ingredientName} kinetics`}. New runs will use it.</Alert>}
      {mine.length > 0 && (
        <ul className="text-small text-ink-700">
          {mine.map((c) => (
            <li key={c.id}>
              Active from this log: {c.scope === 'contact' ? `contact ${c.contactCase}, UA × ${f3(c.parameters.uaMultiplier ?? 1)}` : `${c.ingredientName}${c.parameters.rateConstantPerMin ? `, k = ${f3(c.parameters.rateConstantPerMin)} /min` : ''}${c.parameters.enthalpyFactor ? `, ΔH × ${f3(c.parameters.enthalpyFactor)}` : ''}`} — applied by {c.appliedBy}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
