import { Router } from 'express';
import { requireAuth } from '../auth/auth.middleware';
import { homeFor } from './home.service';
import './home.openapi';

export const homeRouter = Router();

homeRouter.get('/', requireAuth, async (req, res) => {
  res.json(await homeFor(req.user!));
});
