// Boots the optimisation thread with the TypeScript loader the main process runs under.
import { register } from 'tsx/esm/api';

register();
await import('./optimise-thread.ts');
