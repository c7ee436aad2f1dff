import { z } from 'zod';
import { idParamsSchema, paged } from '@shared/schemas';
import { applyCalibrationSchema, candidateConfidenceResponseSchema, calibrationListQuerySchema, fitRequestSchema, labLogListQuerySchema } from '@shared/schemas/lab-logs';
import { documentRoute } from '../openapi/registry';

const any = z.object({}).passthrough();
const logFile = z.string().meta({ format: 'binary', description: 'A logger CSV or text file (.csv, .txt, .tsv), UTF-8' });
documentRoute({ method: 'post', path: '/lab-logs/preview', summary: 'Read an uploaded logger CSV (multipart field "file"): delimiter, header, columns, first rows, row errors and a suggested mapping; nothing stored', tag: 'lab-logs', roles: ['chemist', 'admin'], multipart: z.object({ file: logFile }), response: z.object({ preview: any }) });
documentRoute({ method: 'post', path: '/lab-logs', summary: 'Store a lab log: multipart "file" plus "meta" JSON {name, candidateId | components, mapping, conditions}; 400 with row errors and nothing stored when malformed', tag: 'lab-logs', roles: ['chemist', 'admin'], multipart: z.object({ file: logFile, meta: z.string().meta({ description: 'JSON: {name, candidateId | components, mapping, conditions, notes}' }) }), status: 201, response: z.object({ labLog: any }) });
documentRoute({ method: 'get', path: '/lab-logs', summary: 'Lab logs of the workspace (optionally of one candidate), paged', tag: 'lab-logs', roles: 'any', query: labLogListQuerySchema, response: paged(any) });
documentRoute({ method: 'get', path: '/lab-logs/:id', summary: 'One lab log: samples, predicted and fitted overlays, RMSE, minutes in band', tag: 'lab-logs', roles: 'any', params: idParamsSchema, response: any });
documentRoute({ method: 'post', path: '/lab-logs/:id/fit', summary: 'Levenberg–Marquardt fit of UA, enthalpy factor and rate constant to the log, with standard errors', tag: 'lab-logs', roles: ['chemist', 'admin'], params: idParamsSchema, body: fitRequestSchema, response: z.object({ fit: any }) });
documentRoute({ method: 'get', path: '/calibrations', summary: 'Calibrations of the workspace, active and retired (?active= filters), paged', tag: 'lab-logs', roles: 'any', query: calibrationListQuerySchema, response: paged(any) });
documentRoute({ method: 'post', path: '/calibrations', summary: 'Apply a lab-log fit to a contact case or an ingredient (audited); later runs use it', tag: 'lab-logs', roles: ['chemist', 'admin'], body: applyCalibrationSchema, response: z.object({ calibration: any }) });
documentRoute({ method: 'get', path: '/candidates/:id/confidence', summary: 'Monte Carlo band (5–95 %) around the predicted curve and the probability of meeting the brief', tag: 'lab-logs', roles: 'any', params: idParamsSchema, response: candidateConfidenceResponseSchema });
