import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { Button, buttonClasses } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { QueryError } from '@/components/ui/query-error';
import { Loading } from '@/components/ui/spinner';
import { dossierPdfHref, getDossierQueryOptions, useDossier } from '@/features/reviews/api/get-dossier';
import { DossierView } from '@/features/reviews/components/dossier-view';
import { requireUser } from '../../../guards';
import { idFrom } from '@/lib/route-params';

type Paper = 'a4' | 'letter';


export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const id = idFrom(params.id);
    if (id) void queryClient.prefetchQuery(getDossierQueryOptions(id));
    return null;
  };

/**
 * Print rules: the page size follows the paper chosen (A4 210 × 297 mm, Letter 8.5 × 11 in), the
 * app's header, navigation, footer and the toolbar are left off, and sections do not split
 * their headings from their content.
 */
function printCss(paper: Paper): string {
  const size = paper === 'letter' ? 'letter portrait' : 'A4 portrait';
  const margin = paper === 'letter' ? '0.7in 0.75in' : '18mm 16mm';
  return `
@page { size: ${size}; margin: ${margin}; }
@media print {
  html, body { background: #fff !important; }
  header:not(.dossier *), nav:not(.dossier *), footer:not(.dossier *), .dossier-toolbar, a[href="#main"] { display: none !important; }
  main { max-width: none !important; padding: 0 12px !important; margin: 0 !important; }
  .dossier { width: auto !important; }
  .dossier button { display: none !important; }
  .dossier { font-size: 10.5pt; }
  .dossier h2 { break-after: avoid; }
  .dossier-section, .dossier li, .dossier tr { break-inside: avoid; }
  .dossier a { color: inherit; text-decoration: none; }
}`;
}

export default function DossierRoute() {
  const id = idFrom(useParams().id);
  const [search, setSearch] = useSearchParams();
  const [paper, setPaper] = useState<Paper>(search.get('paper') === 'letter' ? 'letter' : 'a4');
  const q = useDossier(id);

  return (
    <>
      <title>{`Dossier · candidate ${id} · Packwright`}</title>
      <style>{printCss(paper)}</style>
      <div className="dossier-toolbar mb-4 flex flex-wrap items-end justify-between gap-4">
        <p className="text-small">
          <Link to={`/candidates/${id}`} className="font-semibold text-frost-700 hover:underline">
            ← Candidate {id}
          </Link>
        </p>
        <div className="flex flex-wrap items-end gap-3">
          <SelectField
            label="Paper"
            value={paper}
            onChange={(e) => {
              const p = e.target.value === 'letter' ? 'letter' : 'a4';
              setPaper(p);
              setSearch({ paper: p }, { replace: true });
            }}
          >
            <option value="a4">A4 (210 × 297 mm)</option>
            <option value="letter">Letter (8.5 × 11 in)</option>
          </SelectField>
          <Button type="button" variant="secondary" onClick={() => window.print()} disabled={!q.data}>
            Print
          </Button>
          {q.data ? (
            <a className={buttonClasses('primary')} href={dossierPdfHref(id, paper)} download>
              Download PDF
            </a>
          ) : (
            // Nothing to download until the dossier has been assembled (or when it could not be).
            <Button type="button" variant="primary" disabled aria-describedby="pdf-why">
              Download PDF
            </Button>
          )}
        </div>
      </div>
      {!q.data && (
        <p id="pdf-why" className="mb-3 text-caption text-ink-500">
          {q.isError ? 'The PDF needs the dossier, which could not be loaded.' : 'The PDF can be downloaded once the dossier is assembled.'}
        </p>
      )}
      {q.isPending ? (
        <Loading label="Assembling the dossier…" />
      ) : q.isError ? (
        <QueryError title="The dossier could not be loaded" error={q.error} onRetry={() => void q.refetch()} retrying={q.isFetching} />
      ) : (
        <DossierView dossier={q.data} />
      )}
    </>
  );
}
