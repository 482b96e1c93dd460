// The screenshot walk (./screen-walk.ts) as a cook.
import { describe } from 'node:test';
import { describeScreenWalk } from './screen-walk.ts';

describe('the screenshot walk as a cook, checked with axe', () => {
  describeScreenWalk(['tobin']);
});
