// `npm run build:cli`: bundle the larder command (see cli-bundle.mjs).
import { buildCli } from './cli-bundle.mjs';

await buildCli();
