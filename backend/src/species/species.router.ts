import { Router } from 'express';
import { createSpeciesRequestSchema, idParamsSchema, speciesListQuerySchema, updateSpeciesRequestSchema } from '@shared/schemas';
import { requireAuth, requireRole } from '../auth/auth.middleware';
import { validate, validated } from '../http/validate';
import { createSpecies, listSpecies, updateSpecies } from './species.service';
import './species.openapi';

export const speciesRouter = Router();
speciesRouter.use(requireAuth);

speciesRouter.get('/', validate({ query: speciesListQuerySchema }), async (req, res) => {
  const { query } = validated(res, { query: speciesListQuerySchema });
  res.json(await listSpecies(req.user!.workspaceId, query));
});

speciesRouter.post('/', requireRole('chemist', 'admin'), validate({ body: createSpeciesRequestSchema }), async (req, res) => {
  const { body } = validated(res, { body: createSpeciesRequestSchema });
  res.status(201).json({ species: await createSpecies(req.user!, body) });
});

speciesRouter.patch('/:id', requireRole('chemist', 'admin'), validate({ params: idParamsSchema, body: updateSpeciesRequestSchema }), async (req, res) => {
  const { params, body } = validated(res, { params: idParamsSchema, body: updateSpeciesRequestSchema });
  res.json({ species: await updateSpecies(req.user!, params.id, body) });
});
