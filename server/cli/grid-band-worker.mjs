// From source: the CLI's grid-band worker thread loads its TypeScript through tsx. The build
// (`npm run build`) writes dist/cli/grid-band-worker.mjs, which needs no loader.
import { register } from 'tsx/esm/api';

register();
await import('./grid-band-thread.ts');
