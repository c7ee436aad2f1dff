import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Paged } from '@shared/schemas';
import type { ApplyCalibrationRequest, CreateLabLogRequest } from '@shared/schemas/lab-logs';
import type { CalibrationFit, ColumnMapping, LogColumn, RowError } from '@shared/lab-logs';
import { z } from 'zod';
import { api } from '@/lib/api-client';

/** The server's answer, typed (these payloads are built by the lab-logs service, not a shared schema). */
const answer = <T,>() => z.custom<T>((v) => typeof v === 'object' && v !== null);

/** Lab logs: one fetcher per operation, queryOptions with hierarchical keys, hooks. */

export type LabLogPreview = {
  delimiter: string;
  headerRow: number | null;
  preamble: string[];
  columns: LogColumn[];
  firstRows: string[][];
  rowCount: number;
  errors: RowError[];
  suggested: ColumnMapping | null;
  filename: string;
  sizeBytes: number;
};

export type LabLogSummary = {
  id: number;
  name: string;
  candidateId: number | null;
  filename: string;
  sizeBytes: number;
  sampleCount: number;
  channels: string[];
  conditions: CreateLabLogRequest['conditions'];
  fitted: boolean;
  rmseK: number | null;
  createdBy: string;
  createdAt: string;
};

export type StoredFit = CalibrationFit & { elapsedMs: number; fittedBy: string };

type Overlay = {
  points: { tMin: number; measuredC: number; predictedC: number; residualK: number }[];
  rmseK: number;
  biasK: number;
  maxAbsResidualK: number;
  compared: number;
  minutesInBand: { measured: number; predicted: number } | null;
  spanMin: number;
};

export type LabLogDetail = {
  labLog: LabLogSummary & {
    sha256: string;
    delimiter: string;
    headerRow: number | null;
    preamble: string[];
    startedAt: string | null;
    mapping: ColumnMapping;
    notes: string | null;
    scenario: { components: { key: string; massG: number; kind: string }[]; ambientC: number; contact: string; packAreaM2: number; initialTempC: number; horizonMin: number };
    fit: StoredFit | null;
  };
  samples: number[][];
  band: { minC: number; maxC: number } | null;
  briefName: string | null;
  predicted: { curve: { tMin: number; tempC: number }[]; overlay: Overlay; error: string | null };
  fitted: { curve: { tMin: number; tempC: number }[]; overlay: Overlay } | null;
};

export type Calibration = {
  id: number;
  scope: 'contact' | 'ingredient';
  contactCase: string | null;
  ingredientId: number | null;
  ingredientName: string | null;
  parameters: { uaMultiplier?: number; rateConstantPerMin?: number; enthalpyFactor?: number; standardErrors?: Record<string, number>; rmseK?: number };
  labLogId: number | null;
  active: boolean;
  appliedBy: string;
  createdAt: string;
};

export const labLogKeys = {
  all: ['lab-logs'] as const,
  list: (candidateId?: number) => ['lab-logs', 'list', candidateId ?? null] as const,
  detail: (id: number) => ['lab-logs', 'detail', id] as const,
  calibrations: ['calibrations'] as const,
};

export interface LabLogPageParams {
  page: number;
  pageSize: number;
}
const FIRST_PAGE: LabLogPageParams = { page: 1, pageSize: 20 };

/** One page of the workspace's lab logs (of one candidate when given), newest first. */
export const labLogsQueryOptions = (candidateId?: number, params: LabLogPageParams = FIRST_PAGE) =>
  queryOptions({
    queryKey: [...labLogKeys.list(candidateId), params] as const,
    queryFn: () => api.get('/api/lab-logs', { query: { candidateId, ...params }, schema: answer<Paged<LabLogSummary>>() }),
    placeholderData: keepPreviousData,
  });
export const labLogQueryOptions = (id: number) =>
  queryOptions({ queryKey: labLogKeys.detail(id), queryFn: () => api.get(`/api/lab-logs/${id}`, { schema: answer<LabLogDetail>() }) });
/** The active calibrations of the workspace (at most one per contact case and ingredient, so one page of 200 holds them). */
export const calibrationsQueryOptions = () =>
  queryOptions({
    queryKey: [...labLogKeys.calibrations, { active: true }] as const,
    queryFn: () => api.get('/api/calibrations', { query: { active: true, pageSize: 200 }, schema: answer<Paged<Calibration>>() }),
  });

export const useLabLogs = (candidateId?: number, params?: LabLogPageParams) => useQuery(labLogsQueryOptions(candidateId, params));
export const useLabLog = (id: number) => useQuery(labLogQueryOptions(id));
export const useCalibrations = () => useQuery(calibrationsQueryOptions());

export function previewLabLog(file: File): Promise<{ preview: LabLogPreview }> {
  const body = new FormData();
  body.set('file', file);
  return api.post('/api/lab-logs/preview', { body, schema: answer<{ preview: LabLogPreview }>() });
}
export const usePreviewLabLog = () => useMutation({ mutationFn: previewLabLog });

export function createLabLog({ file, meta }: { file: File; meta: CreateLabLogRequest }): Promise<{ labLog: LabLogSummary }> {
  const body = new FormData();
  body.set('file', file);
  body.set('meta', JSON.stringify(meta));
  return api.post('/api/lab-logs', { body, schema: answer<{ labLog: LabLogSummary }>() });
}
export function useCreateLabLog() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createLabLog, onSuccess: () => qc.invalidateQueries({ queryKey: labLogKeys.all }) });
}

export function useFitLabLog(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (fit: ('ua' | 'enthalpy' | 'rate')[]) => api.post(`/api/lab-logs/${id}/fit`, { body: { fit }, schema: answer<{ fit: StoredFit }>() }),
    onSuccess: () => qc.invalidateQueries({ queryKey: labLogKeys.all }),
  });
}

export function useApplyCalibration() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ApplyCalibrationRequest) => api.post('/api/calibrations', { body, schema: answer<{ calibration: Calibration }>() }),
    onSuccess: () => qc.invalidateQueries({ queryKey: labLogKeys.calibrations }),
  });
}

export type IngredientOption = { id: number; name: string; grade: string | null; role: string };
/** Ingredients to build the logged mixture from (the workspace library, by name). */
export const mixtureIngredientsQueryOptions = () =>
  queryOptions({
    queryKey: ['lab-logs', 'ingredient-options'] as const,
    queryFn: () => api.get('/api/ingredients', { query: { pageSize: 100, sort: 'name' }, schema: answer<Paged<IngredientOption>>() }),
  });
export const useMixtureIngredients = () => useQuery(mixtureIngredientsQueryOptions());
