import { useRef, useState } from 'react';
import { INGREDIENT_CSV_COLUMNS, type ImportResponse } from '@shared/schemas/library';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { errorMessage, isApiError } from '@/lib/api-client';
import { formatCount } from '@/lib/format';
import { EXPORT_CSV_HREF, importProblems, useImportIngredients, type ImportProblem } from '../api/import-ingredients';

type Outcome =
  | { kind: 'checked'; result: ImportResponse; fileName: string }
  | { kind: 'problems'; problems: ImportProblem[]; message: string; fileName: string }
  | { kind: 'failed'; message: string }
  | { kind: 'imported'; result: ImportResponse; fileName: string };

/**
 * CSV import in two steps: "check the file" (a dry run that writes nothing and reports every bad
 * row, field and rule), then import, all or nothing.
 */
export function CsvImport() {
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const importer = useImportIngredients();
  const checking = importer.isPending && importer.variables.dryRun;
  const importing = importer.isPending && !importer.variables.dryRun;

  const run = (dryRun: boolean) => {
    if (!file) return;
    const fileName = file.name;
    importer.mutate(
      { file, dryRun },
      {
        onSuccess: (result) => setOutcome({ kind: dryRun ? 'checked' : 'imported', result, fileName }),
        onError: (error) => {
          const problems = importProblems(error);
          if (isApiError(error) && error.status === 400 && problems.length > 0) {
            setOutcome({ kind: 'problems', problems, message: error.message, fileName });
          } else setOutcome({ kind: 'failed', message: errorMessage(error) });
        },
      },
    );
  };

  const checkedThisFile = outcome?.kind === 'checked' && file !== null && outcome.fileName === file.name;

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-col gap-2">
        <label htmlFor="ingredient-csv" className="text-small font-semibold text-ink-800">
          Ingredient CSV file
        </label>
        <input
          id="ingredient-csv"
          ref={input}
          type="file"
          accept=".csv,text/csv"
          aria-describedby="ingredient-csv-hint"
          onChange={(event) => {
            setFile(event.target.files?.[0] ?? null);
            setOutcome(null);
            importer.reset();
          }}
          className="text-small file:mr-3 file:rounded-control file:border file:border-ink-200 file:bg-surface file:px-3 file:py-1.5 file:font-semibold"
        />
        <p id="ingredient-csv-hint" className="text-caption text-ink-500">
          A header row, then one row per ingredient. Columns: <code className="font-mono">{INGREDIENT_CSV_COLUMNS.join(', ')}</code>.
          name, role and costPerKg are required; process is JSON; several sources share a cell, separated by “ | ”. A row
          with the name and grade of an existing ingredient updates it. The{' '}
          <a href={EXPORT_CSV_HREF} download className="font-semibold text-frost-700 underline">
            exported library
          </a>{' '}
          is a ready-made example.
        </p>
      </div>

      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" disabled={!file || importing} pending={checking} pendingLabel="Checking…" onClick={() => run(true)}>
          Check the file
        </Button>
        <Button disabled={!checkedThisFile || checking} pending={importing} pendingLabel="Importing…" onClick={() => run(false)}>
          Import
        </Button>
      </div>

      {outcome?.kind === 'checked' && (
        <Alert tone="success" title={`${outcome.fileName}: every row is valid`}>
          {formatCount(outcome.result.rows, 'row')} checked: {formatCount(outcome.result.created, 'new ingredient')},{' '}
          {formatCount(outcome.result.updated, 'update')}. Nothing has been written yet — choose Import to add them.
        </Alert>
      )}

      {outcome?.kind === 'imported' && (
        <Alert
          tone="success"
          title="Imported"
          action={
            <ButtonLink to="/library" size="sm" variant="secondary">
              Open the library
            </ButtonLink>
          }
        >
          {formatCount(outcome.result.created, 'ingredient')} added and {formatCount(outcome.result.updated, 'ingredient')} updated from{' '}
          {outcome.fileName}.
        </Alert>
      )}

      {outcome?.kind === 'failed' && <Alert tone="danger" title="The file could not be checked">{outcome.message}</Alert>}

      {outcome?.kind === 'problems' && <ImportReport fileName={outcome.fileName} problems={outcome.problems} />}
    </div>
  );
}

function ImportReport({ fileName, problems }: { fileName: string; problems: ImportProblem[] }) {
  const badRows = new Set(problems.map((p) => p.row)).size;
  const sorted = [...problems].sort((a, b) => (a.row ?? 0) - (b.row ?? 0));
  return (
    <section aria-labelledby="import-report-title" className="flex flex-col gap-3">
      <Alert tone="danger" title={<span id="import-report-title">Nothing was imported: {formatCount(badRows, 'row')} of {fileName} {badRows === 1 ? 'needs' : 'need'} fixing</span>}>
        Fix the rows below in the file (row numbers as your spreadsheet shows them; the header is row 1), choose it again and
        check it once more. The import is all or nothing.
      </Alert>
      <div className="overflow-x-auto rounded-control border border-ink-100">
        <table className="w-full text-left text-small">
          <caption className="sr-only">Problems found in {fileName}, by row</caption>
          <thead className="bg-ink-50 text-caption font-bold tracking-wide text-ink-500 uppercase">
            <tr>
              <th scope="col" className="px-3 py-2">Row</th>
              <th scope="col" className="px-3 py-2">Field</th>
              <th scope="col" className="px-3 py-2">Rule</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-ink-100">
            {sorted.map((p, k) => (
              <tr key={k}>
                <th scope="row" className="px-3 py-2 font-bold tabular-nums">
                  {p.row ?? '—'}
                </th>
                <td className="px-3 py-2 font-mono text-caption">{p.field}</td>
                <td className="px-3 py-2 text-ink-800">{p.message}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
