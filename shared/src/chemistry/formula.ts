import { ATOMIC_WEIGHTS, isElementSymbol } from './atomic-weights';
import type { Phase } from './types';

/**
 * A formula that cannot be read. `position` is the 1-based character position in the input
 * where the problem was found (0 when the problem is the input as a whole).
 */
export class FormulaError extends Error {
  override readonly name = 'FormulaError';
  readonly formula: string;
  readonly position: number;

  constructor(message: string, options: { formula: string; position: number }) {
    super(message);
    this.formula = options.formula;
    this.position = options.position;
  }
}

/** One dot-separated part of a formula: `6H2O` in `CaCl2·6H2O` has coefficient 6. */
export interface FormulaPart {
  coefficient: number;
  /** The part as written, without its coefficient, e.g. `H2O`. */
  text: string;
  /** Element counts of one unit of the part (not multiplied by the coefficient). */
  elements: Record<string, number>;
}

export interface ParsedFormula {
  /** The input, unchanged. */
  input: string;
  /** The formula without phase tag and charge, hydrate dots normalised to `·`. */
  formula: string;
  /** Total element counts, e.g. `{ Ca: 1, Cl: 2, H: 12, O: 6 }` for `CaCl2·6H2O`. */
  elements: Record<string, number>;
  /** Net charge in elementary charges (`SO4^2-` → −2). */
  charge: number;
  /** Phase tag when one was given (`(aq)` → `aq`, `(s)` → `cr`), else null. */
  phase: Phase | null;
  /** The dot-separated parts, first the main one, then e.g. the water of crystallisation. */
  parts: FormulaPart[];
}

const PHASE_TAGS: Record<string, Phase> = {
  cr: 'cr',
  s: 'cr',
  c: 'cr',
  l: 'l',
  g: 'g',
  aq: 'aq',
  ai: 'ai',
  ao: 'ao',
};

const SUPERSCRIPTS: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '⁺': '+', '⁻': '-',
};
const SUBSCRIPTS: Record<string, string> = {
  '₀': '0', '₁': '1', '₂': '2', '₃': '3', '₄': '4', '₅': '5', '₆': '6', '₇': '7', '₈': '8', '₉': '9',
};

const OPEN_TO_CLOSE: Record<string, string> = { '(': ')', '[': ']', '{': '}' };
const HYDRATE_SEPARATORS = new Set(['·', '.', '*', '•', '∙', '⋅']);

function isDigit(ch: string | undefined): boolean {
  return ch !== undefined && ch >= '0' && ch <= '9';
}
function isUpper(ch: string | undefined): boolean {
  return ch !== undefined && ch >= 'A' && ch <= 'Z';
}
function isLower(ch: string | undefined): boolean {
  return ch !== undefined && ch >= 'a' && ch <= 'z';
}

function addInto(target: Record<string, number>, source: Record<string, number>, factor: number): void {
  for (const [el, n] of Object.entries(source)) target[el] = (target[el] ?? 0) + n * factor;
}

/**
 * Whether the digits before a trailing sign (no `^`) are the charge rather than a count.
 * A monatomic ion takes them as the charge (`Ca2+` is Ca²⁺, `Fe3+` Fe³⁺, `O2-` oxide); a
 * polyatomic one takes one digit as a count (`NH4+`, `NO3-`, `HCO3-`) and, with two or more
 * digits, the last as the charge (`SO42-` is SO₄²⁻, `PO43-` PO₄³⁻, `Cr2O72-`). A single-digit
 * charge is the usual case for ions in aqueous chemistry (common practice, no source).
 */
function isChargeDigits(before: string, digits: string): boolean {
  if (digits.length > 1) return true;
  if (digits === '0') return false;
  return /^[A-Z][a-z]?$/.test(before);
}

/**
 * Split off a trailing phase tag and a trailing charge. Returns the core formula, the charge
 * and the phase. Charge forms: `NH4+`, `Fe++`, `SO4^2-`, `Ca^2+`, `Ca2+`, `Ca+2`, `SO4^-2`, `SO4-2`,
 * `SO42-`, `Fe+3`, `SO4²⁻`. Digits before a sign without `^` follow isChargeDigits: `NH4+` is +1, `Ca2+` is +2.
 */
function splitSuffixes(input: string): { core: string; charge: number; phase: Phase | null } {
  let s = input.trim().replace(/−/g, '-');
  let phase: Phase | null = null;
  const phaseMatch = /\(\s*([a-z]{1,2})\s*\)\s*$/.exec(s);
  if (phaseMatch) {
    const tag = phaseMatch[1] as string;
    const mapped = PHASE_TAGS[tag];
    if (!mapped) {
      throw new FormulaError(
        `Unknown phase tag "(${tag})" at position ${phaseMatch.index + 1}: expected one of (cr), (s), (l), (g), (aq), (ai), (ao).`,
        { formula: input, position: phaseMatch.index + 1 },
      );
    }
    phase = mapped;
    s = s.slice(0, phaseMatch.index).trimEnd();
  }
  // Unicode superscript charge, e.g. SO₄²⁻.
  const sup = /[⁰¹²³⁴⁵⁶⁷⁸⁹]*[⁺⁻]+$/.exec(s);
  if (sup) {
    const plain = [...sup[0]].map((c) => SUPERSCRIPTS[c] ?? c).join('');
    s = `${s.slice(0, sup.index)}^${plain}`;
  }
  s = [...s].map((c) => SUBSCRIPTS[c] ?? c).join('');

  let charge = 0;
  let m: RegExpExecArray | null;
  if ((m = /\^(\d*)([+-])$/.exec(s))) {
    charge = (m[2] === '+' ? 1 : -1) * (m[1] ? Number(m[1]) : 1);
    s = s.slice(0, m.index);
  } else if ((m = /\^([+-])(\d+)$/.exec(s))) {
    charge = (m[1] === '+' ? 1 : -1) * Number(m[2]);
    s = s.slice(0, m.index);
  } else if ((m = /(\d+)([+-])$/.exec(s)) && isChargeDigits(s.slice(0, m.index), m[1] as string)) {
    // `Ca2+`, `Fe3+`, `SO42-`: the charge written before its sign, as in print (see isChargeDigits).
    const digits = m[1] as string;
    const count = digits.length > 1 ? digits.slice(0, -1) : '';
    charge = (m[2] === '+' ? 1 : -1) * Number(digits.slice(-1));
    s = s.slice(0, m.index) + count;
  } else if ((m = /\^?([+-]+)$/.exec(s))) {
    const signs = m[1] as string;
    if (/^\++$|^-+$/.test(signs)) charge = (signs[0] === '+' ? 1 : -1) * signs.length;
    else throw new FormulaError(`Mixed charge signs "${signs}" at position ${m.index + 1}.`, { formula: input, position: m.index + 1 });
    s = s.slice(0, m.index);
  } else if ((m = /([+-])(\d+)$/.exec(s))) {
    charge = (m[1] === '+' ? 1 : -1) * Number(m[2]);
    s = s.slice(0, m.index);
  }
  return { core: s.trimEnd(), charge, phase };
}

/**
 * Parse a chemical formula into element counts, charge and phase.
 *
 * Reads element symbols with integer counts, nested brackets `()`, `[]`, `{}` with counts,
 * hydrate/adduct parts after `·`, `.`, `*` or `•` with an optional leading coefficient
 * (integer or decimal, e.g. `2.75H2O`), a trailing charge (`NH4+`, `SO4^2-`, `SO4-2`, `Fe+3`,
 * `Ca^2+`, `Fe++`) and a trailing phase tag (`(cr)`, `(s)`, `(l)`, `(g)`, `(aq)`, `(ai)`, `(ao)`).
 * Organic condensed forms such as `CH3COONa` and `CO(NH2)2` are read as written.
 *
 * Errors are {@link FormulaError}s naming the problem and its 1-based position:
 * an empty formula, an unknown element symbol, an unbalanced bracket, a stray character.
 *
 * @example parseFormula('CaCl2·6H2O(cr)')
 * // → { elements: { Ca: 1, Cl: 2, H: 12, O: 6 }, charge: 0, phase: 'cr', ... }
 * @example parseFormula('SO4^2-').charge // → -2
 */
export function parseFormula(input: string): ParsedFormula {
  if (typeof input !== 'string' || input.trim() === '') {
    throw new FormulaError('Empty formula: expected element symbols such as "NaCl".', { formula: String(input), position: 0 });
  }
  const { core, charge, phase } = splitSuffixes(input);
  if (core === '') {
    throw new FormulaError(`Empty formula in "${input}": expected element symbols before the charge or phase tag.`, {
      formula: input,
      position: 0,
    });
  }
  // Positions in error messages refer to the input; the core is a prefix of the trimmed input.
  const offset = input.length - input.trimStart().length;
  const s = core;
  let i = 0;
  const fail = (msg: string, at: number): never => {
    throw new FormulaError(msg.replace('{pos}', String(at + offset + 1)), { formula: input, position: at + offset + 1 });
  };

  const readInt = (): number | null => {
    const start = i;
    while (isDigit(s[i])) i++;
    return i > start ? Number(s.slice(start, i)) : null;
  };

  // group := (element count? | open group close count?)+
  const readGroup = (closer: string | null, openAt: number): Record<string, number> => {
    const counts: Record<string, number> = {};
    let any = false;
    while (i < s.length) {
      const ch = s[i] as string;
      if (isUpper(ch)) {
        const start = i;
        i++;
        while (isLower(s[i])) i++;
        const symbol = s.slice(start, i);
        if (!isElementSymbol(symbol)) {
          fail(`Unknown element "${symbol}" at position {pos}: expected an element symbol such as "Na" or "Cl".`, start);
        }
        const n = readInt() ?? 1;
        counts[symbol] = (counts[symbol] ?? 0) + n;
        any = true;
      } else if (ch in OPEN_TO_CLOSE) {
        const at = i;
        i++;
        const inner = readGroup(OPEN_TO_CLOSE[ch] as string, at);
        const n = readInt() ?? 1;
        addInto(counts, inner, n);
        any = true;
      } else if (ch === ')' || ch === ']' || ch === '}') {
        if (closer === null) fail(`Unbalanced bracket: "${ch}" at position {pos} has no matching opening bracket.`, i);
        if (ch !== closer) fail(`Unbalanced bracket: expected "${closer}" at position {pos}, found "${ch}".`, i);
        if (!any) fail(`Empty brackets at position {pos}: expected element symbols inside.`, openAt);
        i++;
        return counts;
      } else if (HYDRATE_SEPARATORS.has(ch)) {
        if (closer !== null) fail(`Unbalanced bracket: "${s[openAt]}" at position {pos} is not closed before the hydrate dot.`, openAt);
        return counts;
      } else if (isLower(ch)) {
        fail(`Unknown element "${ch}" at position {pos}: element symbols start with a capital letter.`, i);
      } else if (isDigit(ch)) {
        fail(`Unexpected number at position {pos}: a count must follow an element symbol or a bracket.`, i);
      } else {
        fail(`Unexpected character "${ch}" at position {pos}.`, i);
      }
    }
    if (closer !== null) fail(`Unbalanced bracket: "${s[openAt]}" at position {pos} is never closed.`, openAt);
    return counts;
  };

  const parts: FormulaPart[] = [];
  const elements: Record<string, number> = {};
  for (;;) {
    while (s[i] === ' ') i++;
    const partStart = i;
    let coefficient = 1;
    if (isDigit(s[i])) {
      const m = /^\d+(?:\.\d+)?/.exec(s.slice(i)) as RegExpExecArray;
      coefficient = Number(m[0]);
      i += m[0].length;
      if (parts.length === 0 && coefficient !== 1) {
        fail(`Unexpected leading number at position {pos}: write the coefficient in the reaction, not the formula.`, partStart);
      }
    }
    const textStart = i;
    const counts = readGroup(null, i);
    const text = s.slice(textStart, i).trim();
    if (text === '') {
      fail(
        parts.length === 0 ? `Empty formula at position {pos}: expected element symbols.` : `Empty hydrate part at position {pos}: expected e.g. "6H2O" after the dot.`,
        textStart,
      );
    }
    parts.push({ coefficient, text, elements: counts });
    addInto(elements, counts, coefficient);
    if (i >= s.length) break;
    i++; // skip the hydrate separator
  }

  const formula = parts.map((p, k) => (k === 0 || p.coefficient === 1 ? p.text : `${p.coefficient}${p.text}`)).join('·');
  return { input, formula, elements, charge, phase, parts };
}

/**
 * Molar mass in g/mol: Σ nᵢ·Aᵣ(i) over the element counts, with the CIAAW 2021 abridged standard
 * atomic weights (see atomic-weights.ts). The electron mass (0.000549 g/mol per charge) is
 * neglected, as in tabulated ionic molar masses.
 *
 * @example molarMass('NH4NO3') // → 80.043
 * @example molarMass('CaCl2·6H2O') // → 219.07
 */
export function molarMass(formula: string | ParsedFormula): number {
  const parsed = typeof formula === 'string' ? parseFormula(formula) : formula;
  let sum = 0;
  for (const [el, n] of Object.entries(parsed.elements)) {
    const entry = ATOMIC_WEIGHTS[el];
    if (!entry || entry.asaw === null) {
      throw new FormulaError(`No standard atomic weight for "${el}" in "${parsed.input}": CIAAW 2021 gives none for this element.`, {
        formula: parsed.input,
        position: 0,
      });
    }
    sum += n * entry.asaw;
  }
  return sum;
}

/**
 * Hill-order formula of a composition (C first, then H, then the rest alphabetically; with no C,
 * all alphabetically), with the charge appended as `^2-`. Used to compare formulas written in
 * different ways: `hillFormula(parseFormula('CH3COONa'))` equals that of `NaCH3CO2` → `C2H3NaO2`.
 */
export function hillFormula(parsed: Pick<ParsedFormula, 'elements' | 'charge'>): string {
  const els = Object.keys(parsed.elements).filter((e) => (parsed.elements[e] ?? 0) !== 0);
  const hasC = els.includes('C');
  const ordered = hasC
    ? ['C', ...(els.includes('H') ? ['H'] : []), ...els.filter((e) => e !== 'C' && e !== 'H').sort()]
    : [...els].sort();
  const body = ordered
    .map((e) => {
      const n = parsed.elements[e] as number;
      const rounded = Math.round(n * 1e6) / 1e6;
      return rounded === 1 ? e : `${e}${rounded}`;
    })
    .join('');
  if (parsed.charge === 0) return body;
  const mag = Math.abs(parsed.charge);
  return `${body}^${mag === 1 ? '' : mag}${parsed.charge > 0 ? '+' : '-'}`;
}

/**
 * Split a hydrate into its anhydrous part and its water of crystallisation: trailing parts that
 * are exactly `H2O` are counted as water. `CaCl2·6H2O` → `{ anhydrous: 'CaCl2', waterCount: 6 }`;
 * `NaCl` → `{ anhydrous: 'NaCl', waterCount: 0 }`.
 */
export function splitHydrate(formula: string | ParsedFormula): { anhydrous: string; waterCount: number } {
  const parsed = typeof formula === 'string' ? parseFormula(formula) : formula;
  let waterCount = 0;
  const kept: FormulaPart[] = [];
  for (const [k, p] of parsed.parts.entries()) {
    const isWater = k > 0 && p.text === 'H2O';
    if (isWater) waterCount += p.coefficient;
    else kept.push(p);
  }
  const anhydrous = kept.map((p, k) => (k === 0 || p.coefficient === 1 ? p.text : `${p.coefficient}${p.text}`)).join('·');
  return { anhydrous, waterCount };
}
