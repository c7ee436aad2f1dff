import { Fragment, type ReactNode } from 'react';

/** NBS phase codes in words, for where a person reads them. */
export const PHASE_WORDS: Record<string, string> = {
  cr: 'solid',
  l: 'liquid',
  g: 'gas',
  aq: 'aqueous',
  ai: 'aqueous, ions',
  ao: 'aqueous, undissociated',
};

export function phaseInWords(phase: string | null | undefined): string {
  return phase ? (PHASE_WORDS[phase] ?? phase) : '';
}

/**
 * Splits a formula as written (`Ca(OH)2`, `CaCl2·6H2O`, `SO4^2-`, `Ca2+`, `NH4NO3(cr)`) into its
 * body, its charge and its phase tag: counts become subscripts, the charge a superscript.
 */
function pieces(text: string): { body: { t: string; sub: boolean }[]; charge: string; phase: string | null } {
  let s = text.trim().replace(/−/g, '-');
  let phase: string | null = null;
  const tag = /\(\s*(cr|s|c|l|g|aq|ai|ao)\s*\)\s*$/.exec(s);
  if (tag) {
    phase = tag[1] === 's' || tag[1] === 'c' ? 'cr' : (tag[1] as string);
    s = s.slice(0, tag.index).trimEnd();
  }
  let charge = '';
  let m: RegExpExecArray | null;
  if ((m = /\^(\d*)([+-])$/.exec(s)) || (m = /\^([+-])(\d+)$/.exec(s))) {
    const [digits, sign] = /\d/.test(m[1] as string) ? [m[1] as string, m[2] as string] : [m[2] as string, m[1] as string];
    charge = `${digits === '1' ? '' : digits}${sign}`;
    s = s.slice(0, m.index);
  } else if ((m = /([+-]+)$/.exec(s))) {
    const before = s.slice(0, m.index);
    const digits = /(\d+)$/.exec(before)?.[1] ?? '';
    // As the parser reads it: a monatomic ion's digits, or the last of two or more, are the charge.
    const monatomic = /^[A-Z][a-z]?\d$/.test(before);
    if (m[1]!.length === 1 && digits && (monatomic || digits.length > 1)) {
      charge = `${digits.slice(-1)}${m[1]}`;
      s = before.slice(0, -1);
    } else {
      charge = m[1]!.length > 1 ? `${m[1]!.length}${m[1]![0]}` : (m[1] as string);
      s = before;
    }
  } else if ((m = /([+-])(\d+)$/.exec(s)) && /[A-Za-z)\]]$/.test(s.slice(0, m.index))) {
    charge = `${m[2] === '1' ? '' : m[2]}${m[1]}`;
    s = s.slice(0, m.index);
  }
  const body: { t: string; sub: boolean }[] = [];
  // Digits right after an element, a bracket or a count are subscripts; digits after the hydrate dot are a coefficient.
  const re = /(\d+(?:\.\d+)?)|([^\d]+)/g;
  let part: RegExpExecArray | null;
  while ((part = re.exec(s))) {
    if (part[1]) {
      const prev = s[part.index - 1];
      const sub = prev !== undefined && /[A-Za-z)\]}]/.test(prev);
      body.push({ t: part[1], sub });
    } else body.push({ t: (part[2] as string).replace(/[.*•∙⋅]/g, '·'), sub: false });
  }
  return { body, charge: charge.replace('-', '−'), phase };
}

/**
 * A chemical formula as a person reads it: subscript counts, superscript charge, and the phase in
 * words after it when `phase` is given or tagged in the text (`showPhase`). The text is kept for
 * screen readers and copy as written.
 */
export function Formula({ text, phase, showPhase = false, className }: { text: string; phase?: string | null; showPhase?: boolean; className?: string }): ReactNode {
  const p = pieces(text);
  const ph = phase ?? p.phase;
  return (
    <span className={className}>
      <span className="whitespace-nowrap">
        {p.body.map((b, k) => (b.sub ? <sub key={k} className="text-[0.75em]">{b.t}</sub> : <Fragment key={k}>{b.t}</Fragment>))}
        {p.charge && <sup className="text-[0.75em]">{p.charge}</sup>}
      </span>
      {showPhase && ph && <span className="ml-1 text-[0.85em] font-normal text-ink-500">({phaseInWords(ph)})</span>}
    </span>
  );
}
