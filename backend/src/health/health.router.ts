import { Router } from 'express';
import { sequelize } from '../db/sequelize';
import './health.openapi';

const DB_CHECK_TIMEOUT_MS = 2000;

export const healthRouter = Router();

/** 200 while PostgreSQL answers; 503 with db "down" while it does not. The pool reconnects by itself. */
healthRouter.get('/', async (_req, res) => {
  const dbUp = await Promise.race([
    sequelize.query('SELECT 1').then(() => true, () => false),
    new Promise<boolean>((resolve) => setTimeout(() => resolve(false), DB_CHECK_TIMEOUT_MS).unref()),
  ]);
  res.status(dbUp ? 200 : 503).json({ status: dbUp ? 'ok' : 'degraded', db: dbUp ? 'up' : 'down' });
});
