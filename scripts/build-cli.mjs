// `npm run build:cli`: bundle the larder command (see bundles.mjs).
import { buildBundle } from './bundles.mjs';

await buildBundle('cli');
