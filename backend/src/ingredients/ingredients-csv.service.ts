import Papa from 'papaparse';
import {
  CSV_SOURCES_SEPARATOR,
  INGREDIENT_CSV_COLUMNS,
  createIngredientRequestSchema,
  fieldErrorsFromZod,
  type FieldError,
  type ImportResponse,
} from '@shared/schemas';
import { sequelize } from '../db/sequelize';
import { AppError } from '../http/errors';
import { recordAudit } from '../audit/audit.service';
import type { AuthUser } from '../auth/session-user';
import { workspaceChemistryLibrary } from '../species/species.service';
import { IngredientRecord } from './ingredient.model';
import { findByNaturalKey, referenceErrors, snapshot, valuesFromCreate, type IngredientValues } from './ingredients.service';

type Column = (typeof INGREDIENT_CSV_COLUMNS)[number];
const MAX_ROWS = 5000;

/**
 * Cells a spreadsheet would run as a formula begin with `=`, `+`, `-`, `@` (or tab / carriage
 * return). Export prefixes such a text cell with `'`, which spreadsheets show as text; import
 * removes that one `'` again, so an exported file imports unchanged.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

/**
 * Escapes one export cell against spreadsheet formula injection. Only text is escaped: a number
 * (even a negative one such as -5) is a number to the spreadsheet, not a formula, and escaping it
 * would turn it into text that no longer sums or sorts.
 */
export function csvCell(value: string | number | null | undefined): string | number {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return value;
  return FORMULA_START.test(value) ? `'${value}` : value;
}

function unescapeCell(value: string): string {
  return value.startsWith("'") && FORMULA_START.test(value.slice(1)) ? value.slice(1) : value;
}

/** The library as CSV, columns as in INGREDIENT_CSV_COLUMNS; text cells escaped by {@link csvCell}. */
export async function exportIngredientsCsv(workspaceId: number): Promise<string> {
  const rows = await IngredientRecord.findAll({ where: { workspaceId }, order: [['name', 'ASC'], ['grade', 'ASC'], ['id', 'ASC']] });
  const data = rows.map((r) => [
    csvCell(r.name),
    csvCell(r.grade),
    csvCell(r.role),
    csvCell(r.speciesKey),
    csvCell(r.process ? JSON.stringify(r.process) : ''),
    // NUMERIC(12,4) has at most 12 significant digits, which a double prints exactly: a number cell.
    Number(r.costPerKg),
    csvCell(r.currency),
    csvCell(r.densityGPerMl),
    csvCell(r.cpJPerGK),
    csvCell((r.sources ?? []).join(CSV_SOURCES_SEPARATOR)),
    csvCell(r.notes),
  ]);
  return Papa.unparse({ fields: [...INGREDIENT_CSV_COLUMNS], data }, { newline: '\r\n', escapeFormulae: false });
}

interface ParsedRow {
  rowNumber: number;
  values: IngredientValues;
}

function invalid(fields: FieldError[], rowCount: number): AppError {
  const badRows = new Set(fields.map((f) => f.field.split('.')[1])).size;
  const shown = fields.slice(0, 5).map((f) => `${f.field} ${f.message}`).join('; ');
  return new AppError({
    status: 400,
    code: 'import_invalid',
    message: `${badRows} of ${rowCount} rows are invalid, so nothing was imported: ${shown}${fields.length > 5 ? '; …' : ''}`,
    fields,
  });
}

function fileError(message: string): AppError {
  return AppError.validation(message, [{ field: 'file', message }]);
}

/** A cell → the value the shared schema reads: empty cells are absent, numbers parsed, JSON read. */
function cellValue(column: Column, raw: string, errors: FieldError[], rowNumber: number): unknown {
  const text = unescapeCell(raw.trim());
  if (text === '') {
    if (column === 'speciesKey' || column === 'process' || column === 'densityGPerMl' || column === 'cpJPerGK') return null;
    return undefined;
  }
  switch (column) {
    case 'process':
      try {
        return JSON.parse(text);
      } catch (error) {
        errors.push({ field: `rows.${rowNumber}.process`, message: `is not valid JSON (${error instanceof Error ? error.message : 'parse error'})` });
        return undefined;
      }
    case 'densityGPerMl':
    case 'cpJPerGK': {
      const n = Number(text);
      return Number.isFinite(n) ? n : text;
    }
    case 'sources':
      return text.split('|').map((s) => s.trim()).filter(Boolean);
    default:
      return text;
  }
}

/**
 * Reads and checks every row of an ingredient CSV (header row first). Row numbers are those a
 * spreadsheet shows: the header is row 1, the first ingredient row 2.
 */
async function parseImport(actor: AuthUser, csvText: string): Promise<{ rows: ParsedRow[]; total: number }> {
  const text = csvText.replace(/^\uFEFF/, '');
  const parsed = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false });
  const structural = parsed.errors.filter((e) => e.type === 'Quotes' || e.code === 'UndetectableDelimiter' && parsed.data.length > 1);
  if (structural.length) {
    const e = structural[0]!;
    throw fileError(`The file is not readable CSV: ${e.message}${e.row === undefined ? '' : ` (row ${e.row + 1})`}.`);
  }
  const [headerCells, ...records] = parsed.data;
  if (!headerCells || headerCells.every((c) => c.trim() === '')) throw fileError('The file is empty: expected a header row, then one row per ingredient.');
  const header = headerCells.map((c) => c.trim());
  const errors: FieldError[] = [];
  const known = new Set<string>(INGREDIENT_CSV_COLUMNS);
  header.forEach((name) => {
    if (!known.has(name)) errors.push({ field: `rows.1.${name || '(empty)'}`, message: `is not a known column (expected: ${INGREDIENT_CSV_COLUMNS.join(', ')})` });
  });
  for (const required of ['name', 'role', 'costPerKg'] as const) {
    if (!header.includes(required)) errors.push({ field: `rows.1.${required}`, message: 'column is missing from the header row' });
  }
  const seenColumns = new Set<string>();
  header.forEach((name) => {
    if (seenColumns.has(name)) errors.push({ field: `rows.1.${name}`, message: 'column appears twice' });
    seenColumns.add(name);
  });
  if (errors.length) throw invalid(errors, records.length);
  if (records.length > MAX_ROWS) throw fileError(`The file has ${records.length} rows; at most ${MAX_ROWS} can be imported at once.`);

  const lib = await workspaceChemistryLibrary(actor.workspaceId);
  const rows: ParsedRow[] = [];
  const firstRowOf = new Map<string, number>();
  let total = 0;
  records.forEach((cells, k) => {
    const rowNumber = k + 2;
    if (cells.every((c) => c.trim() === '')) return;
    total++;
    if (cells.length > header.length) {
      errors.push({ field: `rows.${rowNumber}`, message: `has ${cells.length} cells but the header has ${header.length} columns` });
      return;
    }
    const rowErrors: FieldError[] = [];
    const input: Record<string, unknown> = {};
    header.forEach((column, c) => {
      const value = cellValue(column as Column, cells[c] ?? '', rowErrors, rowNumber);
      if (value !== undefined) input[column] = value;
    });
    if (rowErrors.length === 0) {
      const result = createIngredientRequestSchema.safeParse(input);
      if (!result.success) {
        rowErrors.push(...fieldErrorsFromZod(result.error, `rows.${rowNumber}`));
      } else {
        const values = valuesFromCreate(result.data, actor.workspace.currency);
        rowErrors.push(...referenceErrors(lib, values).map((e) => ({ ...e, field: `rows.${rowNumber}.${e.field}` })));
        const naturalKey = `${values.name.toLowerCase()}\u0000${values.grade.toLowerCase()}`;
        const first = firstRowOf.get(naturalKey);
        if (first !== undefined) rowErrors.push({ field: `rows.${rowNumber}.name`, message: `repeats the name and grade of row ${first}` });
        else firstRowOf.set(naturalKey, rowNumber);
        if (rowErrors.length === 0) rows.push({ rowNumber, values });
      }
    }
    errors.push(...rowErrors);
  });
  if (errors.length) throw invalid(errors, total);
  if (total === 0) throw fileError('The file has a header row but no ingredient rows.');
  return { rows, total };
}

/**
 * Imports a CSV all or nothing: every row is checked first; one bad row imports nothing and the
 * answer names each bad row, field and rule. A row whose name and grade match an ingredient of the
 * library updates it (version + 1); the others are created. Every change is audited.
 * `dryRun` checks and counts without writing.
 */
export async function importIngredientsCsv(actor: AuthUser, csvText: string, dryRun: boolean): Promise<ImportResponse> {
  const { rows, total } = await parseImport(actor, csvText);
  return sequelize.transaction(async (transaction) => {
    let created = 0;
    let updated = 0;
    for (const { rowNumber, values } of rows) {
      const existing = await findByNaturalKey(actor.workspaceId, values.name, values.grade, transaction);
      if (existing) {
        updated++;
        if (dryRun) continue;
        const before = snapshot(existing);
        await existing.update({ ...values, version: existing.version + 1, updatedById: actor.id }, { transaction });
        await existing.reload({ transaction });
        await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'ingredient.update', entityType: 'ingredient', entityId: existing.id, detail: { before, after: snapshot(existing), via: 'import', row: rowNumber } }, transaction);
      } else {
        created++;
        if (dryRun) continue;
        const row = await IngredientRecord.create({ ...values, workspaceId: actor.workspaceId, createdById: actor.id, updatedById: actor.id }, { transaction });
        await recordAudit({ workspaceId: actor.workspaceId, actorId: actor.id, action: 'ingredient.create', entityType: 'ingredient', entityId: row.id, detail: { before: null, after: snapshot(row), via: 'import', row: rowNumber } }, transaction);
      }
    }
    return { dryRun, rows: total, created, updated };
  });
}
