import Papa from 'papaparse';

/**
 * Reading a data logger's CSV export: delimiter and header detection (papaparse), a preview
 * of the columns, and the mapping of chosen columns and units to samples in SI-ish units
 * (seconds from the first sample, °C).
 */

/** Most data rows a lab log may hold. */
export const LAB_LOG_MAX_ROWS = 50_000;
/** Most temperature channels a lab log may map. */
export const LAB_LOG_MAX_CHANNELS = 8;
/** Fewest samples a lab log must hold to be compared with a prediction. */
export const LAB_LOG_MIN_SAMPLES = 5;
/** Most row errors reported (the rest are counted). */
export const LAB_LOG_MAX_REPORTED_ERRORS = 50;
/** Plausible pack temperatures, °C: outside this a reading is a logger fault or a wrong unit. */
export const LAB_LOG_TEMP_RANGE_C = { min: -80, max: 200 } as const;

export type TimeUnit = 's' | 'min' | 'clock';
export type TempUnit = 'C' | 'F';
export type ColumnKind = 'number' | 'clock' | 'text' | 'empty';

export interface LogColumn {
  index: number;
  name: string;
  kind: ColumnKind;
  /** Unit guessed from the header text, when it names one. */
  unitHint: TimeUnit | TempUnit | null;
}

export interface RowError {
  /** Line number in the file, 1-based. */
  row: number;
  column?: string;
  message: string;
}

export interface LogPreview {
  delimiter: string;
  /** Line number of the header row (1-based), or null when the file has none. */
  headerRow: number | null;
  /** Lines before the header (logger name, serial number…), kept as metadata. */
  preamble: string[];
  columns: LogColumn[];
  /** First data rows as text, for the preview table. */
  firstRows: string[][];
  rowCount: number;
  /** Problems found before any mapping: ragged rows, too many rows. */
  errors: RowError[];
  /** A mapping guessed from the headers and the cells. */
  suggested: ColumnMapping | null;
  /** Internal: every data row with its line number. */
  rows: { line: number; cells: string[] }[];
}

export interface ColumnMapping {
  timeColumn: number;
  timeUnit: TimeUnit;
  tempColumns: number[];
  tempUnit: TempUnit;
}

export interface LogSample {
  tSec: number;
  /** One reading per mapped temperature column, °C. */
  tempsC: number[];
}

export interface MappedLog {
  channels: string[];
  samples: LogSample[];
  errors: RowError[];
  /** Row errors beyond LAB_LOG_MAX_REPORTED_ERRORS. */
  moreErrors: number;
  /** Wall-clock start when the time column carried dates, ISO 8601 without zone. */
  startedAt: string | null;
}

const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;

function isNumber(cell: string): boolean {
  return NUMBER.test(cell.trim());
}

/** Parses a decimal written with a point or (when the delimiter is not a comma) a comma. */
export function parseDecimal(cell: string): number | null {
  const t = cell.trim();
  if (!NUMBER.test(t)) return null;
  const v = Number(t.replace(',', '.'));
  return Number.isFinite(v) ? v : null;
}

interface ClockValue {
  /** Seconds since 1970-01-01 when a date was given, else seconds since midnight. */
  seconds: number;
  dated: boolean;
}

const DATE_PART = String.raw`(?:(\d{4})[-/.](\d{1,2})[-/.](\d{1,2})|(\d{1,2})[-/.](\d{1,2})[-/.](\d{2,4}))`;
const CLOCK = new RegExp(String.raw`^(?:${DATE_PART}[ T,]+)?(\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?\s*([AaPp][Mm])?(?:Z|[+-]\d{2}:?\d{2})?$`);

/**
 * Clock time as written by data loggers: `hh:mm:ss`, `hh:mm`, `hh:mm:ss.sss`, with an optional
 * AM/PM, optionally after a date `YYYY-MM-DD`, `YYYY/MM/DD` or `DD/MM/YYYY` (`DD.MM.YYYY`);
 * `T`, space or comma between. A slashed date with a first part above 12 is day-first; one with
 * a second part above 12 is month-first (US); otherwise day-first (assumption; the offset from
 * the first sample is what matters and is the same either way within a day).
 *
 * @example parseClock('2024-05-01 14:03:22').seconds - parseClock('2024-05-01 14:02:52').seconds // → 30
 */
export function parseClock(cell: string): ClockValue | null {
  const m = CLOCK.exec(cell.trim());
  if (!m) return null;
  let hour = Number(m[7]);
  const minute = Number(m[8]);
  const second = m[9] ? Number(m[9]) : 0;
  const frac = m[10] ? Number(`0.${m[10]}`) : 0;
  const ampm = m[11]?.toLowerCase();
  if (ampm) {
    if (hour < 1 || hour > 12) return null;
    hour = (hour % 12) + (ampm === 'pm' ? 12 : 0);
  }
  if (hour > 23 || minute > 59 || second > 60) return null;
  const daySeconds = hour * 3600 + minute * 60 + second + frac;
  if (m[1] === undefined && m[4] === undefined) return { seconds: daySeconds, dated: false };
  let year: number;
  let month: number;
  let day: number;
  if (m[1] !== undefined) {
    year = Number(m[1]);
    month = Number(m[2]);
    day = Number(m[3]);
  } else {
    const a = Number(m[4]);
    const b = Number(m[5]);
    year = Number(m[6]);
    if (year < 100) year += 2000;
    if (b > 12 && a <= 12) {
      month = a;
      day = b;
    } else {
      day = a;
      month = b;
    }
  }
  if (month < 1 || month > 12 || day < 1 || day > 31) return null;
  return { seconds: Date.UTC(year, month - 1, day) / 1000 + daySeconds, dated: true };
}

function unitHintOf(name: string): TimeUnit | TempUnit | null {
  const n = name.toLowerCase();
  if (/°\s*f|\bdeg\s*f\b|\(f\)|\[f\]|fahrenheit|_f\b/.test(n)) return 'F';
  if (/°\s*c|\bdeg\s*c\b|\(c\)|\[c\]|celsius|_c\b/.test(n)) return 'C';
  if (/\bmin(ute)?s?\b|\(min\)|\[min\]/.test(n)) return 'min';
  if (/\bsec(ond)?s?\b|\(s\)|\[s\]|elapsed/.test(n)) return 's';
  if (/date|clock|timestamp/.test(n)) return 'clock';
  return null;
}

function isDataRow(cells: string[]): boolean {
  const filled = cells.filter((c) => c.trim() !== '');
  return filled.length >= 2 && filled.every((c) => isNumber(c) || parseClock(c) !== null);
}

/**
 * Reads a logger's CSV: papaparse detects the delimiter (comma, semicolon, tab, pipe); the
 * header is the row just above the first data row (every cell a number or a clock time, with
 * another data row within the next two) when it has text in it, and lines above it are kept as the preamble. Each column
 * is classed as number, clock or text from its cells, and a mapping is suggested: the first
 * clock column (else a column named like a time) for time, the remaining numeric columns for
 * temperature, units from the header text (°F, (min), …).
 *
 * @example previewLog('time (s),T (°C)\n0,25\n30,18.2\n60,9.1').suggested
 * // → { timeColumn: 0, timeUnit: 's', tempColumns: [1], tempUnit: 'C' }
 */
export function previewLog(text: string): LogPreview {
  const body = text.replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(body, { delimiter: '', skipEmptyLines: 'greedy', delimitersToGuess: [',', ';', '\t', '|'] });
  const delimiter = parsed.meta.delimiter;
  const all = parsed.data.map((cells) => cells.map((c) => (c ?? '').trim()));
  // papaparse counts lines; with greedy skipping we recover line numbers from the cursor.
  const lines = lineNumbers(body, all.length, parsed);
  let first = -1;
  // The first data row: one followed by another within two rows (so one bad row early on is a row error, not the header).
  for (let i = 0; i + 1 < all.length; i++) {
    if (isDataRow(all[i]!) && (isDataRow(all[i + 1]!) || (i + 2 < all.length && isDataRow(all[i + 2]!)))) {
      first = i;
      break;
    }
  }
  if (first < 0 && all.length === 1 && isDataRow(all[0]!)) first = 0;
  const errors: RowError[] = [];
  if (first < 0) {
    return {
      delimiter,
      headerRow: null,
      preamble: all.slice(0, 5).map((r) => r.join(delimiter)),
      columns: [],
      firstRows: all.slice(0, 10),
      rowCount: 0,
      errors: [{ row: 1, message: 'expected rows of numbers or clock times (time and temperature), found none: is this a data logger export?' }],
      suggested: null,
      rows: [],
    };
  }
  const headerIndex = first > 0 && all[first - 1]!.some((c) => c !== '' && !isNumber(c)) ? first - 1 : null;
  const width = Math.max(...all.slice(first, first + 20).map((r) => r.length));
  const header = headerIndex !== null ? all[headerIndex]! : [];
  const rows = all.slice(first).map((cells, k) => ({ line: lines[first + k]!, cells }));
  if (rows.length > LAB_LOG_MAX_ROWS) {
    errors.push({ row: rows[LAB_LOG_MAX_ROWS]!.line, message: `expected at most ${LAB_LOG_MAX_ROWS.toLocaleString('en')} data rows, found ${rows.length.toLocaleString('en')}` });
  }
  for (const r of rows) {
    if (r.cells.length !== width && errors.length < LAB_LOG_MAX_REPORTED_ERRORS) {
      errors.push({ row: r.line, message: `expected ${width} cells, found ${r.cells.length}` });
    }
  }
  const columns: LogColumn[] = [];
  for (let c = 0; c < width; c++) {
    const name = header[c] && header[c] !== '' ? header[c]! : `column ${c + 1}`;
    const cells = rows.slice(0, 200).map((r) => r.cells[c] ?? '').filter((x) => x !== '');
    let kind: ColumnKind = 'empty';
    if (cells.length) {
      if (cells.every(isNumber)) kind = 'number';
      else if (cells.every((x) => parseClock(x) !== null)) kind = 'clock';
      else kind = 'text';
    }
    columns.push({ index: c, name, kind, unitHint: unitHintOf(name) });
  }
  return {
    delimiter,
    headerRow: headerIndex !== null ? lines[headerIndex]! : null,
    preamble: all.slice(0, headerIndex ?? first).map((r) => r.filter((c) => c !== '').join(' ')),
    columns,
    firstRows: rows.slice(0, 10).map((r) => r.cells),
    rowCount: rows.length,
    errors,
    suggested: suggestMapping(columns),
    rows,
  };
}

function lineNumbers(body: string, count: number, parsed: Papa.ParseResult<string[]>): number[] {
  // Map each kept row to its line: walk the text's lines, skipping blank ones as papaparse does.
  // (Quoted cells spanning lines are rare in logger exports; they shift later numbers by one.)
  void parsed;
  const out: number[] = [];
  const textLines = body.split(/\r\n|\n|\r/);
  for (let i = 0; i < textLines.length && out.length < count; i++) {
    if (textLines[i]!.trim().replace(/[,;\t|]/g, '') === '') continue;
    out.push(i + 1);
  }
  while (out.length < count) out.push(out.length ? out[out.length - 1]! + 1 : 1);
  return out;
}

function suggestMapping(columns: LogColumn[]): ColumnMapping | null {
  const timeCol =
    columns.find((c) => c.kind === 'clock') ??
    columns.find((c) => c.kind === 'number' && /time|elapsed|sec|min|^t$/i.test(c.name) && !/temp/i.test(c.name)) ??
    columns.find((c) => c.kind === 'number');
  if (!timeCol) return null;
  const temps = columns.filter((c) => c.index !== timeCol.index && c.kind === 'number').slice(0, LAB_LOG_MAX_CHANNELS);
  if (temps.length === 0) return null;
  const timeUnit: TimeUnit = timeCol.kind === 'clock' ? 'clock' : timeCol.unitHint === 'min' ? 'min' : 's';
  const tempUnit: TempUnit = temps.some((c) => c.unitHint === 'F') ? 'F' : 'C';
  return { timeColumn: timeCol.index, timeUnit, tempColumns: temps.map((c) => c.index), tempUnit };
}

/** °F → °C: (F − 32)·5/9 (definition of the Fahrenheit scale, NIST SP 811 §B.8). @example fahrenheitToC(212) // → 100 */
export function fahrenheitToC(f: number): number {
  return ((f - 32) * 5) / 9;
}

/**
 * Applies a column mapping to a preview: time in seconds from the first sample (seconds,
 * minutes × 60, or clock times — a clock without dates that runs backwards by more than 12 h
 * has passed midnight), temperatures in °C (°F converted). Every row that cannot be read gives
 * a row error with its line number: an unreadable time or reading, time not increasing, a
 * reading outside {@link LAB_LOG_TEMP_RANGE_C}. Also errors: a mapping naming a column that
 * does not exist, too few samples, too many rows or channels.
 *
 * @example mapColumns(previewLog('min,°F\n0,77\n1,64.4'), { timeColumn: 0, timeUnit: 'min', tempColumns: [1], tempUnit: 'F' }).samples
 * // → [{ tSec: 0, tempsC: [25] }, { tSec: 60, tempsC: [18] }]
 */
export function mapColumns(preview: LogPreview, mapping: ColumnMapping): MappedLog {
  const errors: RowError[] = [...preview.errors];
  let more = 0;
  const push = (e: RowError) => {
    if (errors.length < LAB_LOG_MAX_REPORTED_ERRORS) errors.push(e);
    else more++;
  };
  const width = preview.columns.length;
  const colName = (i: number) => preview.columns[i]?.name ?? `column ${i + 1}`;
  const bad = [mapping.timeColumn, ...mapping.tempColumns].filter((i) => !Number.isInteger(i) || i < 0 || i >= width);
  if (bad.length) {
    return { channels: [], samples: [], errors: [{ row: preview.headerRow ?? 1, message: `expected column numbers 0 to ${width - 1}, found ${bad.join(', ')}` }], moreErrors: 0, startedAt: null };
  }
  if (mapping.tempColumns.length === 0 || mapping.tempColumns.length > LAB_LOG_MAX_CHANNELS) {
    return { channels: [], samples: [], errors: [{ row: preview.headerRow ?? 1, message: `expected 1 to ${LAB_LOG_MAX_CHANNELS} temperature columns, found ${mapping.tempColumns.length}` }], moreErrors: 0, startedAt: null };
  }
  if (mapping.tempColumns.includes(mapping.timeColumn)) {
    return { channels: [], samples: [], errors: [{ row: preview.headerRow ?? 1, column: colName(mapping.timeColumn), message: 'the time column cannot also be a temperature column' }], moreErrors: 0, startedAt: null };
  }
  const samples: LogSample[] = [];
  let t0: number | null = null;
  let dated = false;
  let dayOffset = 0;
  let prevRaw: number | null = null;
  let prevT: number | null = null;
  let startedAt: string | null = null;
  for (const r of preview.rows.slice(0, LAB_LOG_MAX_ROWS)) {
    const timeCell = r.cells[mapping.timeColumn] ?? '';
    let t: number | null = null;
    if (mapping.timeUnit === 'clock') {
      const c = parseClock(timeCell);
      if (!c) {
        push({ row: r.line, column: colName(mapping.timeColumn), message: `expected a clock time such as 14:03:22 or 2024-05-01 14:03:22, found "${timeCell}"` });
        continue;
      }
      let raw = c.seconds;
      if (!c.dated) {
        if (prevRaw !== null && raw + dayOffset < prevRaw - 12 * 3600) dayOffset += 86400;
        raw += dayOffset;
      } else if (t0 === null) {
        dated = true;
        startedAt = new Date(c.seconds * 1000).toISOString().slice(0, 19);
      }
      prevRaw = raw;
      t = raw;
    } else {
      const v = parseDecimal(timeCell);
      if (v === null) {
        push({ row: r.line, column: colName(mapping.timeColumn), message: `expected a number of ${mapping.timeUnit === 'min' ? 'minutes' : 'seconds'}, found "${timeCell}"` });
        continue;
      }
      t = mapping.timeUnit === 'min' ? v * 60 : v;
    }
    const temps: number[] = [];
    let rowOk = true;
    for (const ci of mapping.tempColumns) {
      const cell = r.cells[ci] ?? '';
      const v = parseDecimal(cell);
      if (v === null) {
        push({ row: r.line, column: colName(ci), message: `expected a temperature in °${mapping.tempUnit}, found "${cell}"` });
        rowOk = false;
        continue;
      }
      const c = mapping.tempUnit === 'F' ? fahrenheitToC(v) : v;
      if (c < LAB_LOG_TEMP_RANGE_C.min || c > LAB_LOG_TEMP_RANGE_C.max) {
        push({ row: r.line, column: colName(ci), message: `expected a reading between ${LAB_LOG_TEMP_RANGE_C.min} and ${LAB_LOG_TEMP_RANGE_C.max} °C, found ${round(c)} °C (${cell} °${mapping.tempUnit}): a logger fault or the wrong unit?` });
        rowOk = false;
        continue;
      }
      temps.push(c);
    }
    if (!rowOk) continue;
    if (t0 === null) t0 = t;
    const tSec = t - t0;
    if (prevT !== null && !(tSec > prevT)) {
      push({ row: r.line, column: colName(mapping.timeColumn), message: `expected time to increase, found ${round(tSec)} s after ${round(prevT)} s` });
      continue;
    }
    prevT = tSec;
    samples.push({ tSec, tempsC: temps });
  }
  if (errors.length === 0 && samples.length < LAB_LOG_MIN_SAMPLES) {
    errors.push({ row: preview.rows.at(-1)?.line ?? 1, message: `expected at least ${LAB_LOG_MIN_SAMPLES} samples, found ${samples.length}` });
  }
  void dated;
  return { channels: mapping.tempColumns.map(colName), samples, errors, moreErrors: more, startedAt };
}

function round(x: number): number {
  return Math.round(x * 100) / 100;
}
