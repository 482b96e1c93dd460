// `npm run bench`: every benchmark in turn; each prints its own figures and target.
import { benchCliStart } from './cli-start.ts';

benchCliStart();
