// `npm run build:server`: bundle the server (see bundles.mjs).
import { buildBundle } from './bundles.mjs';

await buildBundle('server');
