import { Router } from 'express';
import { idParamsSchema } from '@shared/schemas';
import { updateIngredientHazardsRequestSchema } from '@shared/schemas/reviews';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { getIngredientHazards, hStatements, updateIngredientHazards } from './hazards.service';
import './hazards.openapi';

/** Mounted at /api/ingredients beside the ingredients router: /:id/hazards. */
export const ingredientHazardsRouter = Router();
ingredientHazardsRouter.use('/:id/hazards', requireAuth);

ingredientHazardsRouter.get('/:id/hazards', validate({ params: idParamsSchema }), async (req, res) => {
  const { params } = validated(res, { params: idParamsSchema });
  res.json(await getIngredientHazards(req.user!.workspaceId, params.id));
});

ingredientHazardsRouter.put('/:id/hazards', requireRole('chemist', 'admin'), validate({ params: idParamsSchema, body: updateIngredientHazardsRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: updateIngredientHazardsRequestSchema });
  res.json(await updateIngredientHazards(req.user!, params.id, body.hazardData, body.version));
});

/** Mounted at /api/hazards. */
export const hazardsRouter = Router();
hazardsRouter.use(requireAuth);
hazardsRouter.get('/h-statements', (_req, res) => {
  res.json(hStatements());
});
