// Entry of an audit worker thread (see workers.ts): registers the TypeScript loader the backend
// runs under, then loads the worker itself.
import { register } from 'tsx/esm/api';

register();
await import('./audit-worker.ts');
