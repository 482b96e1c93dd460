// The screenshot walk (./screen-walk.ts) as a reviewer.
import { describe } from 'node:test';
import { describeScreenWalk } from './screen-walk.ts';

describe('the screenshot walk as a reviewer, checked with axe', () => {
  describeScreenWalk(['imke']);
});
