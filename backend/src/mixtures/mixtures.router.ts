import { Router } from 'express';
import { evaluateMixtureRequestSchema } from '@shared/schemas/mixtures';
import { requireAuth } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { evaluateMixtureFor } from './mixtures.service';
import './mixtures.openapi';

export const mixturesRouter = Router();
mixturesRouter.use(requireAuth);

mixturesRouter.post('/evaluate', validate({ body: evaluateMixtureRequestSchema }), async (req, res) => {
  const { body } = validated(res, { body: evaluateMixtureRequestSchema });
  res.json(await evaluateMixtureFor(req.user!, body));
});
