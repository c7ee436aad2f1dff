import { evaluateMixtureApiResponseSchema } from '@shared/schemas';
import { evaluateMixtureRequestSchema } from '@shared/schemas/mixtures';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'post', path: '/mixtures/evaluate', summary: 'Evaluate a mixture: end, minimum and maximum temperature, dissolved fraction, curve, minutes in band, mass, cost (uaWPerK 0 and packHeatCapacityJPerK 0 give the adiabatic case); inputs beyond the data come back as warnings', tag: 'thermo', roles: 'any', body: evaluateMixtureRequestSchema, response: evaluateMixtureApiResponseSchema });
