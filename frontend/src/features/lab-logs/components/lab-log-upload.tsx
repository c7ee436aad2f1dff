import { useState } from 'react';
import { useNavigate } from 'react-router';
import { CONTACT_CASES } from '@shared/schemas/briefs';
import type { CreateLabLogRequest } from '@shared/schemas/lab-logs';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { SelectField, TextField } from '@/components/ui/field';
import { errorMessage, isApiError } from '@/lib/api-client';
import { useCreateLabLog, useMixtureIngredients, usePreviewLabLog, type LabLogPreview } from '../api/lab-logs';

const CONTACT_LABELS: Record<(typeof CONTACT_CASES)[number], string> = {
  'still-air': 'Still air',
  'skin-through-fabric': 'On skin through fabric',
  insulated: 'Insulated',
};

type ComponentRow = { source: string; massG: string };

/**
 * Upload → preview → map columns and units → test conditions → stored. The server reads the
 * file (delimiter, header, columns); the chemist confirms which column is time (seconds,
 * minutes or clock time) and which are temperatures (°C or °F). Row errors come back with
 * their line numbers and nothing is stored until the file is clean.
 */
export function LabLogUpload({ candidateId }: { candidateId?: number }) {
  const navigate = useNavigate();
  const preview = usePreviewLabLog();
  const create = useCreateLabLog();
  const ingredients = useMixtureIngredients();
  const [file, setFile] = useState<File | null>(null);
  const [p, setP] = useState<LabLogPreview | null>(null);
  const [timeColumn, setTimeColumn] = useState(0);
  const [timeUnit, setTimeUnit] = useState<'s' | 'min' | 'clock'>('s');
  const [tempColumns, setTempColumns] = useState<number[]>([]);
  const [tempUnit, setTempUnit] = useState<'C' | 'F'>('C');
  const [name, setName] = useState('');
  const [ambientC, setAmbientC] = useState('24');
  const [contact, setContact] = useState<(typeof CONTACT_CASES)[number]>('still-air');
  const [packMassG, setPackMassG] = useState('');
  const [channel, setChannel] = useState(0);
  const [rows, setRows] = useState<ComponentRow[]>([
    { source: '', massG: '' },
    { source: '', massG: '' },
  ]);

  const onFile = (f: File | null) => {
    setFile(f);
    setP(null);
    create.reset();
    if (!f) return;
    setName((n) => n || f.name.replace(/\.[^.]+$/, ''));
    preview.mutate(f, {
      onSuccess: ({ preview: pr }) => {
        setP(pr);
        if (pr.suggested) {
          setTimeColumn(pr.suggested.timeColumn);
          setTimeUnit(pr.suggested.timeUnit);
          setTempColumns(pr.suggested.tempColumns);
          setTempUnit(pr.suggested.tempUnit);
        }
      },
    });
  };

  const submit = () => {
    if (!file || !p) return;
    const components = rows
      .filter((r) => r.source && r.massG)
      .map((r) => (r.source.startsWith('ing:') ? { ingredientId: Number(r.source.slice(4)), massG: Number(r.massG) } : { formula: r.source.replace(/^f:/, ''), massG: Number(r.massG) }));
    const meta: CreateLabLogRequest = {
      name: name.trim(),
      ...(candidateId ? { candidateId } : { components }),
      mapping: { timeColumn, timeUnit, tempColumns, tempUnit },
      conditions: { ambientC: Number(ambientC), contact, channel, ...(packMassG ? { packMassG: Number(packMassG) } : {}) },
    };
    create.mutate({ file, meta }, { onSuccess: ({ labLog }) => void navigate(`/lab-logs/${labLog.id}`) });
  };

  const rowErrors = isApiError(create.error) ? create.error.fields : [];
  const columnName = (i: number) => p?.columns[i]?.name ?? `column ${i + 1}`;

  return (
    <Card>
      <CardHeader title="Upload a lab log" description="A CSV or text export from a data logger: time in seconds, minutes or clock time; temperatures in °C or °F; one or more channels." />
      <CardBody className="flex flex-col gap-5">
        <TextField label="Logger file (.csv, .txt)" type="file" accept=".csv,.txt,.tsv,text/csv,text/plain" onChange={(e) => onFile(e.currentTarget.files?.[0] ?? null)} />
        {preview.isPending && <p className="text-small text-ink-500">Reading the file…</p>}
        {preview.isError && <Alert tone="danger" title="The file was not accepted">{errorMessage(preview.error)}</Alert>}

        {p && (
          <>
            <section aria-labelledby="lab-preview" className="flex flex-col gap-2">
              <h3 id="lab-preview" className="text-small font-bold text-ink-900">
                Preview: {p.rowCount.toLocaleString('en')} data rows, delimiter “{p.delimiter === '\t' ? 'tab' : p.delimiter}”{p.headerRow ? `, header on line ${p.headerRow}` : ', no header'}
              </h3>
              {p.preamble.length > 0 && <p className="text-caption text-ink-500">Above the header: {p.preamble.join(' · ')}</p>}
              <div className="max-h-64 overflow-auto rounded-control border border-ink-100">
                <table className="w-full text-left text-small tabular-nums">
                  <caption className="sr-only">First rows of the file</caption>
                  <thead className="sticky top-0 bg-ink-50 text-caption font-bold text-ink-600">
                    <tr>
                      {p.columns.map((c) => (
                        <th key={c.index} scope="col" className="px-3 py-1.5">
                          {c.name} <span className="font-normal text-ink-400">({c.kind})</span>
                        </th>
                      ))}
                    </tr>
                  </thead>
                  <tbody className="divide-y divide-ink-100">
                    {p.firstRows.map((r, i) => (
                      <tr key={i}>
                        {p.columns.map((c) => (
                          <td key={c.index} className="px-3 py-1">
                            {r[c.index] ?? ''}
                          </td>
                        ))}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              {p.errors.length > 0 && (
                <Alert tone="danger" title="Rows that cannot be read">
                  <ul className="list-disc pl-5">
                    {p.errors.map((e) => (
                      <li key={`${e.row}-${e.message}`}>
                        Line {e.row}: {e.message}
                      </li>
                    ))}
                  </ul>
                </Alert>
              )}
            </section>

            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-2 text-small font-bold text-ink-900">Columns and units</legend>
              <SelectField label="Time column" value={String(timeColumn)} onChange={(e) => setTimeColumn(Number(e.currentTarget.value))}>
                {p.columns.map((c) => (
                  <option key={c.index} value={c.index}>
                    {c.name}
                  </option>
                ))}
              </SelectField>
              <SelectField label="Time is written as" value={timeUnit} onChange={(e) => setTimeUnit(e.currentTarget.value as typeof timeUnit)}>
                <option value="s">Seconds from the start</option>
                <option value="min">Minutes from the start</option>
                <option value="clock">Clock time (hh:mm:ss, with or without a date)</option>
              </SelectField>
              <div className="flex flex-col gap-1.5">
                <span className="text-small font-semibold text-ink-800">Temperature columns</span>
                {p.columns
                  .filter((c) => c.index !== timeColumn)
                  .map((c) => (
                    <label key={c.index} className="flex items-center gap-2 text-small text-ink-800">
                      <input
                        type="checkbox"
                        checked={tempColumns.includes(c.index)}
                        onChange={(e) => {
                          const on = e.currentTarget.checked;
                          setTempColumns((cols) => (on ? [...cols, c.index].sort((a, b) => a - b) : cols.filter((x) => x !== c.index)));
                          setChannel(0);
                        }}
                      />
                      {c.name}
                    </label>
                  ))}
              </div>
              <SelectField label="Temperatures are in" value={tempUnit} onChange={(e) => setTempUnit(e.currentTarget.value as typeof tempUnit)}>
                <option value="C">°C</option>
                <option value="F">°F</option>
              </SelectField>
              <SelectField label="The pack's channel (compared with the prediction)" value={String(channel)} onChange={(e) => setChannel(Number(e.currentTarget.value))}>
                {tempColumns.map((c, i) => (
                  <option key={c} value={i}>
                    {columnName(c)}
                  </option>
                ))}
              </SelectField>
            </fieldset>

            <fieldset className="grid gap-4 sm:grid-cols-2">
              <legend className="mb-2 text-small font-bold text-ink-900">Test conditions</legend>
              <TextField label="Name of the log" value={name} onChange={(e) => setName(e.currentTarget.value)} />
              <TextField label="Ambient (°C)" type="number" step="0.1" value={ambientC} onChange={(e) => setAmbientC(e.currentTarget.value)} />
              <SelectField label="Contact" value={contact} onChange={(e) => setContact(e.currentTarget.value as typeof contact)}>
                {CONTACT_CASES.map((c) => (
                  <option key={c} value={c}>
                    {CONTACT_LABELS[c]}
                  </option>
                ))}
              </SelectField>
              <TextField label="Pack mass (g)" hint="For the pouch area; leave empty to use the mixture's mass." type="number" step="1" value={packMassG} onChange={(e) => setPackMassG(e.currentTarget.value)} />
            </fieldset>

            {!candidateId && (
              <fieldset className="flex flex-col gap-3">
                <legend className="mb-2 text-small font-bold text-ink-900">The mixture tested</legend>
                {rows.map((r, i) => (
                  <div key={i} className="grid gap-3 sm:grid-cols-[2fr_1fr]">
                    <SelectField label={`Component ${i + 1}`} value={r.source} onChange={(e) => { const v = e.currentTarget.value; setRows((rs) => rs.map((x, k) => (k === i ? { ...x, source: v } : x))); }}>
                      <option value="">—</option>
                      {(ingredients.data?.items ?? []).map((ing) => (
                        <option key={ing.id} value={`ing:${ing.id}`}>
                          {ing.grade ? `${ing.name} (${ing.grade})` : ing.name}
                        </option>
                      ))}
                    </SelectField>
                    <TextField label={`Component ${i + 1} mass (g)`} type="number" step="0.1" value={r.massG} onChange={(e) => { const v = e.currentTarget.value; setRows((rs) => rs.map((x, k) => (k === i ? { ...x, massG: v } : x))); }} />
                  </div>
                ))}
                <div>
                  <Button variant="ghost" size="sm" onClick={() => setRows((rs) => [...rs, { source: '', massG: '' }])}>
                    Add a component
                  </Button>
                </div>
              </fieldset>
            )}

            {create.isError && (
              <Alert tone="danger" title="Nothing was stored">
                <p>{errorMessage(create.error)}</p>
                {rowErrors.length > 0 && (
                  <ul className="mt-1 list-disc pl-5">
                    {rowErrors.map((f) => (
                      <li key={`${f.field}-${f.message}`}>
                        {f.field}: {f.message}
                      </li>
                    ))}
                  </ul>
                )}
              </Alert>
            )}
            <div>
              <Button onClick={submit} pending={create.isPending} disabled={tempColumns.length === 0 || !name.trim()}>
                Store the lab log
              </Button>
            </div>
          </>
        )}
      </CardBody>
    </Card>
  );
}
