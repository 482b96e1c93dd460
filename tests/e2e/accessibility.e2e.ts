// The screenshot walk (./screen-walk.ts) before signing in and as an admin; the other roles have
// files of their own.
import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { PUBLIC_SCREENS, SCREENS, declaredRoutePaths, describeScreenWalk } from './screen-walk.ts';

describe('the screenshot walk before signing in and as an admin, checked with axe', () => {
  it('should walk every route the console declares', () => {
    const walked = [...PUBLIC_SCREENS, ...SCREENS].map((screen) =>
      screen.path({ lot: ':lot', formula: ':id' }),
    );
    for (const route of declaredRoutePaths()) {
      if (route === '' || route === '**') continue;
      assert.ok(
        walked.some((address) => address.split(/[/?]/).includes(route)),
        `the route "${route}" is not in the walk`,
      );
    }
  });

  describeScreenWalk([null, 'rosa']);
});
