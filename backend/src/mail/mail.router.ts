import { Router } from 'express';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { config } from '../config';
import { MailMessageRecord } from './mail-message.model';
import './mail.openapi';

export const mailRouter = Router();
mailRouter.use(requireAuth, requireRole('admin'));

/** The local mail sink's inbox for this workspace (development and tests). */
mailRouter.get('/', async (req, res) => {
  const rows = await MailMessageRecord.findAll({
    where: { workspaceId: req.user!.workspaceId },
    order: [['receivedAt', 'DESC'], ['id', 'DESC']],
    limit: 200,
  });
  res.json({
    enabled: config.mail.sinkEnabled,
    messages: rows.map((m) => ({
      id: m.id,
      from: m.fromAddress,
      to: m.toAddresses,
      subject: m.subject,
      text: m.text,
      html: m.html,
      receivedAt: m.receivedAt.toISOString(),
    })),
  });
});
