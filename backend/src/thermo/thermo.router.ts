import { Router } from 'express';
import { reactionRequestSchema } from '@shared/schemas';
import { requireAuth } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { chemistryLibraryFor, reactionThermo } from './thermo.service';
import './thermo.openapi';

export const thermoRouter = Router();
thermoRouter.use(requireAuth);

thermoRouter.get('/library', async (req, res) => {
  // Private to the member's workspace; Express adds an ETag, so a revalidation costs a 304.
  res.set('Cache-Control', 'private, max-age=300, must-revalidate');
  res.set('Vary', 'Authorization, Cookie');
  res.json(await chemistryLibraryFor(req.user!.workspaceId));
});

thermoRouter.post('/reaction', validate({ body: reactionRequestSchema }), async (req, res) => {
  const { body } = validated(res, { body: reactionRequestSchema });
  res.json(await reactionThermo(req.user!.workspaceId, body));
});
