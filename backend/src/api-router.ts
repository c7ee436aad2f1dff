import { Router } from 'express';
import { authRouter } from './auth/auth.router';
import { healthRouter } from './health/health.router';
import { homeRouter } from './home/home.router';
import { invitationsRouter } from './invitations/invitations.router';
import { mailRouter } from './mail/mail.router';
import { buildOpenApiDocument } from './openapi/registry';
import { usersRouter } from './users/users.router';
import { speciesRouter } from './species/species.router';
import { ingredientsRouter } from './ingredients/ingredients.router';
import { attachmentsRouter } from './attachments/attachments.router';
import { thermoRouter } from './thermo/thermo.router';
import { mixturesRouter } from './mixtures/mixtures.router';
import { briefsRouter } from './briefs/briefs.router';
import { runsRouter } from './runs/runs.router';
import { candidatesRouter } from './candidates/candidates.router';
import { calibrationsRouter, candidateConfidenceRouter, labLogsRouter } from './lab-logs/lab-logs.router';
import { candidateReviewsRouter, reviewsRouter } from './reviews/reviews.router';
import { hazardsRouter, ingredientHazardsRouter } from './hazards/hazards.router';

/** Every API module mounts here; each router checks its own session and role rules. */
export const apiRouter = Router();
apiRouter.use('/health', healthRouter);
apiRouter.use('/auth', authRouter);
apiRouter.use('/home', homeRouter);
apiRouter.use('/users', usersRouter);
apiRouter.use('/invitations', invitationsRouter);
apiRouter.use('/mail-messages', mailRouter);
apiRouter.use('/species', speciesRouter);
apiRouter.use('/ingredients', ingredientsRouter);
apiRouter.use('/attachments', attachmentsRouter);
apiRouter.use('/thermo', thermoRouter);
apiRouter.use('/mixtures', mixturesRouter);
apiRouter.use('/briefs', briefsRouter);
apiRouter.use('/runs', runsRouter);
apiRouter.use('/candidates', candidatesRouter);
apiRouter.use('/candidates', candidateConfidenceRouter);
apiRouter.use('/lab-logs', labLogsRouter);
apiRouter.use('/calibrations', calibrationsRouter);
apiRouter.use('/candidates', candidateReviewsRouter);
apiRouter.use('/reviews', reviewsRouter);
apiRouter.use('/ingredients', ingredientHazardsRouter);
apiRouter.use('/hazards', hazardsRouter);

let openApiDocument: ReturnType<typeof buildOpenApiDocument> | null = null;
apiRouter.get('/openapi.json', (_req, res) => {
  openApiDocument ??= buildOpenApiDocument();
  res.json(openApiDocument);
});
