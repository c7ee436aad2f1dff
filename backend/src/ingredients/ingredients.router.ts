import { Router } from 'express';
import {
  createIngredientRequestSchema,
  deleteIngredientQuerySchema,
  idParamsSchema,
  attachmentListQuerySchema,
  importQuerySchema,
  ingredientHistoryQuerySchema,
  ingredientListQuerySchema,
  updateIngredientRequestSchema,
} from '@shared/schemas';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { singleUpload, unsupportedType } from '../attachments/upload';
import { ATTACHMENT_MAX_BYTES, addAttachment, listAttachments } from '../attachments/attachments.service';
import { createIngredient, deleteIngredient, getIngredient, ingredientHistory, listIngredients, updateIngredient } from './ingredients.service';
import { exportIngredientsCsv, importIngredientsCsv } from './ingredients-csv.service';
import './ingredients.openapi';

export const IMPORT_MAX_BYTES = 1024 * 1024;
const CSV_EXPECTED = 'a CSV file (.csv or text/csv)';

export const ingredientsRouter = Router();
ingredientsRouter.use(requireAuth);
const canWrite = requireRole('chemist', 'admin');

ingredientsRouter.get('/', validate({ query: ingredientListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: ingredientListQuerySchema });
  res.json(await listIngredients(req.user!.workspaceId, query));
});

ingredientsRouter.get('/export.csv', async (req, res) => {
  const csv = await exportIngredientsCsv(req.user!.workspaceId);
  res.attachment('ingredients.csv');
  res.set({ 'Content-Type': 'text/csv; charset=utf-8', 'Cache-Control': 'private, no-store' });
  res.send(csv);
});

ingredientsRouter.post(
  '/import',
  canWrite,
  validate({ query: importQuerySchema }),
  singleUpload({
    field: 'file',
    maxBytes: IMPORT_MAX_BYTES,
    expected: CSV_EXPECTED,
    accept: (f) => f.mimetype === 'text/csv' || /\.csv$/i.test(f.originalname),
  }),
  async (req, res) => {
    const { query } = validated(res, { query: importQuerySchema });
    const file = req.file!;
    // A text file: no NUL bytes and valid UTF-8 (a binary file renamed .csv is refused).
    let text: string;
    try {
      if (file.buffer.includes(0)) throw new Error('binary');
      text = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
    } catch {
      throw unsupportedType('file', CSV_EXPECTED, `${file.originalname}, whose content is not UTF-8 text`);
    }
    res.json(await importIngredientsCsv(req.user!, text, query.dryRun));
  },
);

ingredientsRouter.get('/:id', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json({ ingredient: await getIngredient(req.user!.workspaceId, params.id) });
});

ingredientsRouter.post('/', canWrite, validate({ body: createIngredientRequestSchema }), async (req, res) => {
  const { body } = validated(res, { body: createIngredientRequestSchema });
  res.status(201).json({ ingredient: await createIngredient(req.user!, body) });
});

ingredientsRouter.patch('/:id', canWrite, validate({ params: idParamsSchema, body: updateIngredientRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: updateIngredientRequestSchema });
  res.json({ ingredient: await updateIngredient(req.user!, params.id, body) });
});

ingredientsRouter.delete('/:id', canWrite, validate({ params: idParamsSchema, query: deleteIngredientQuerySchema }), async (req, res) => {
  const { params, query } = validated(res, { params: idParamsSchema, query: deleteIngredientQuerySchema });
  await deleteIngredient(req.user!, params.id, query.version);
  res.status(204).end();
});

ingredientsRouter.get('/:id/history', validate({ params: idParamsSchema, query: ingredientHistoryQuerySchema }), async (req, res) => {
  const { params, query } = validated(res, { params: idParamsSchema, query: ingredientHistoryQuerySchema });
  res.json(await ingredientHistory(req.user!.workspaceId, params.id, query));
});

ingredientsRouter.get('/:id/attachments', validate({ params: idParamsSchema, query: attachmentListQuerySchema }), async (req, res) => {
  const { params, query } = validated(res, { params: idParamsSchema, query: attachmentListQuerySchema });
  res.json(await listAttachments(req.user!.workspaceId, params.id, query));
});

ingredientsRouter.post(
  '/:id/attachments',
  canWrite,
  validate({ params: idParamsSchema }),
  singleUpload({ field: 'file', maxBytes: ATTACHMENT_MAX_BYTES, expected: 'a PDF document' }),
  async (req, res) => {
    const { params } = validated(res, { params: idParamsSchema });
    res.status(201).json({ attachment: await addAttachment(req.user!, params.id, req.file!) });
  },
);
