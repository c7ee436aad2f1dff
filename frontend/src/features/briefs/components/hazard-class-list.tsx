import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';

/**
 * A free list of GHS hazard classes to leave out (e.g. `ox-sol-3`, `acute-tox-4-oral`). The
 * library's hazard data arrive with the hazards module; the list is kept until then.
 */
export function HazardClassList({ value, onChange, error }: { value: string[]; onChange: (next: string[]) => void; error?: string }) {
  const id = useId();
  const [draft, setDraft] = useState('');
  const add = () => {
    const entries = draft
      .split(',')
      .map((s) => s.trim())
      .filter(Boolean);
    if (entries.length === 0) return;
    onChange([...new Set([...value, ...entries])]);
    setDraft('');
  };
  return (
    <div className="flex flex-col gap-1.5">
      <label htmlFor={id} className="text-small font-semibold text-ink-800">
        Excluded hazard classes
      </label>
      <div className="flex flex-wrap gap-2">
        <input
          id={id}
          value={draft}
          onChange={(e) => setDraft(e.target.value)}
          onKeyDown={(e) => {
            if (e.key === 'Enter') {
              e.preventDefault();
              add();
            }
          }}
          placeholder="ox-sol-3, acute-tox-4-oral"
          aria-describedby={`${id}-hint`}
          aria-invalid={error ? true : undefined}
          className="h-10 min-w-0 flex-1 rounded-control border border-ink-200 bg-surface px-3 text-body"
        />
        <Button variant="secondary" onClick={add} disabled={!draft.trim()}>
          Add
        </Button>
      </div>
      <p id={`${id}-hint`} className="text-caption text-ink-500">
        GHS hazard class codes, separated by commas. Ingredients carrying any of them are left out once hazard data are in
        the library.
      </p>
      {error && <p className="text-caption font-semibold text-rust-600">{error}</p>}
      {value.length > 0 && (
        <ul className="flex flex-wrap gap-2" aria-label="Excluded hazard classes">
          {value.map((c) => (
            <li key={c} className="inline-flex items-center gap-1 rounded-full bg-ink-100 py-0.5 pr-1 pl-3 text-small font-semibold text-ink-800">
              {c}
              <button
                type="button"
                onClick={() => onChange(value.filter((v) => v !== c))}
                className="rounded-full px-1.5 text-ink-600 hover:bg-ink-200 hover:text-ink-900"
                aria-label={`Remove ${c}`}
              >
                ×
              </button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
