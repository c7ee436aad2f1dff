import { Router, type Request } from 'express';
import { idParamsSchema, fieldErrorsFromZod } from '@shared/schemas';
import { applyCalibrationSchema, calibrationListQuerySchema, createLabLogSchema, fitRequestSchema, labLogListQuerySchema } from '@shared/schemas/lab-logs';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { AppError } from '../http/errors';
import { validate, validated } from '../http/validate';
import { singleUpload, unsupportedType } from '../attachments/upload';
import { LAB_LOG_MAX_BYTES, applyCalibration, candidateConfidence, createLabLog, fitLabLog, getLabLog, listCalibrations, listLabLogs, previewLabLog } from './lab-logs.service';
import './lab-logs.openapi';

const CSV_EXPECTED = 'a CSV or text file from a data logger (.csv, .txt or .tsv)';
const chemistOnly = requireRole('chemist', 'admin');
const upload = singleUpload({
  field: 'file',
  maxBytes: LAB_LOG_MAX_BYTES,
  expected: CSV_EXPECTED,
  accept: (f) => ['text/csv', 'text/plain', 'text/tab-separated-values', 'application/vnd.ms-excel'].includes(f.mimetype) || /\.(csv|txt|tsv)$/i.test(f.originalname),
});

/** The uploaded file as UTF-8 text; a binary file renamed .csv answers 415. */
function fileText(req: Request): string {
  const file = req.file!;
  try {
    if (file.buffer.includes(0)) throw new Error('binary');
    return new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    throw unsupportedType('file', CSV_EXPECTED, `${file.originalname}, whose content is not UTF-8 text`);
  }
}

export const labLogsRouter = Router();
labLogsRouter.use(requireAuth);

labLogsRouter.post('/preview', chemistOnly, upload, (req, res) => {
  res.json({ preview: previewLabLog(req.file!, fileText(req)) });
});

labLogsRouter.post('/', chemistOnly, upload, async (req, res) => {
  const text = fileText(req);
  let raw: unknown;
  try {
    raw = JSON.parse(String((req.body as Record<string, unknown> | undefined)?.meta ?? ''));
  } catch {
    throw AppError.validation('Send the name, column mapping and test conditions as JSON in the form field "meta".', [{ field: 'meta', message: 'must be JSON' }]);
  }
  const parsed = createLabLogSchema.safeParse(raw);
  if (!parsed.success) {
    const fields = fieldErrorsFromZod(parsed.error);
    throw AppError.validation(`Invalid request: ${fields.map((f) => `${f.field} ${f.message}`).join('; ')}`, fields);
  }
  res.status(201).json({ labLog: await createLabLog(req.user!, req.file!, text, parsed.data) });
});

labLogsRouter.get('/', validate({ query: labLogListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: labLogListQuerySchema });
  res.json(await listLabLogs(req.user!.workspaceId, query));
});

labLogsRouter.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json(await getLabLog(req.user!.workspaceId, params.id));
});

labLogsRouter.post('/:id/fit', chemistOnly, validate({ params: idParamsSchema, body: fitRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: fitRequestSchema });
  res.json(await fitLabLog(req.user!, params.id, body.fit));
});

export const calibrationsRouter = Router();
calibrationsRouter.use(requireAuth);

calibrationsRouter.get('/', validate({ query: calibrationListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: calibrationListQuerySchema });
  res.json(await listCalibrations(req.user!.workspaceId, query));
});

calibrationsRouter.post('/', chemistOnly, validate({ body: applyCalibrationSchema }), async (req, res) => {
  const { body } = validated(res, { body: applyCalibrationSchema });
  res.status(201).json({ calibration: await applyCalibration(req.user!, body) });
});

/** Mounted on /candidates beside the candidates router: GET /candidates/:id/confidence. */
export const candidateConfidenceRouter = Router();
candidateConfidenceRouter.get('/:id/confidence', requireAuth, validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json({ confidence: await candidateConfidence(req.user!.workspaceId, params.id) });
});
