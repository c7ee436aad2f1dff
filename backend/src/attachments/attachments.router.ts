import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas';
import { requireAuth } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { attachmentForDownload } from './attachments.service';
import './attachments.openapi';

export const attachmentsRouter = Router();
attachmentsRouter.use(requireAuth);

attachmentsRouter.get('/:id/download', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  const file = await attachmentForDownload(req.user!.workspaceId, params.id);
  res.attachment(file.filename);
  res.set({
    'Content-Type': file.contentType,
    'X-Content-Type-Options': 'nosniff',
    'Cache-Control': 'private, no-store',
    'Content-Security-Policy': "default-src 'none'; sandbox",
    ETag: `"${file.sha256}"`,
  });
  res.send(file.bytes);
});
