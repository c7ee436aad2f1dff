import { Router } from 'express';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { mailMessageListQuerySchema } from '@shared/schemas';
import { config } from '../config';
import { pageOf, pageWindow } from '../http/paging';
import { validate, validated } from '../http/validate';
import { MailMessageRecord } from './mail-message.model';
import './mail.openapi';

export const mailRouter = Router();
mailRouter.use(requireAuth, requireRole('admin'));

/** The local mail sink's inbox for this workspace (development and tests). */
mailRouter.get('/', validate({ query: mailMessageListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: mailMessageListQuerySchema });
  const direction = query.sort === 'receivedAt' ? 'ASC' : 'DESC';
  const { rows, count } = await MailMessageRecord.findAndCountAll({
    where: { workspaceId: req.user!.workspaceId },
    order: [['receivedAt', direction], ['id', direction]],
    ...pageWindow(query),
  });
  res.json({
    enabled: config.mail.sinkEnabled,
    ...pageOf(query, rows.map((m) => ({
      id: m.id,
      from: m.fromAddress,
      to: m.toAddresses,
      subject: m.subject,
      text: m.text,
      html: m.html,
      receivedAt: m.receivedAt.toISOString(),
    })), count),
  });
});
