import { chemistryLibraryResponseSchema, reactionRequestSchema, reactionResponseSchema } from '@shared/schemas';
import { documentRoute } from '../openapi/registry';

documentRoute({ method: 'get', path: '/thermo/library', summary: 'The chemistry library of the workspace (species, dilution, solubility, heat capacity, freezing points, eutectics) for instant previews in the browser; cacheable (ETag)', tag: 'thermo', roles: 'any', response: chemistryLibraryResponseSchema });
documentRoute({ method: 'post', path: '/thermo/reaction', summary: 'ΔrH, ΔrS, ΔrG at tempC and the crossover temperature of a balanced reaction (400 naming the field for an unknown formula or an unbalanced reaction)', tag: 'thermo', roles: 'any', body: reactionRequestSchema, response: reactionResponseSchema });
