import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import { DEMO_PEOPLE } from './demo/demo-people.ts';
import { startBanner, type BannerFacts } from './start-banner.ts';

const demo: BannerFacts = {
  config: {
    mode: 'demo',
    dataDir: '/srv/larder/data',
    databaseFile: '/srv/larder/data/larderbook.sqlite',
    formulasDir: '/srv/larder/data/formulas',
    kitchenName: 'Quillmoor Smokehouse',
  },
  url: 'http://127.0.0.1:4310/',
  shippedFormulas: '/srv/larder/formulas',
  demoPeople: DEMO_PEOPLE,
  nobodyYet: false,
  mail: 'the local outbox only',
};

describe('the start banner', () => {
  it('should end with the address, then each demo sign-in with its password, then how to stop', () => {
    const lines = startBanner(demo);
    const open = lines.findIndex((line) => line.includes('at http://127.0.0.1:4310/'));
    assert.ok(open > 0, lines.join('\n'));
    const signIns = lines.slice(open + 2, open + 5);
    assert.match(signIns[0], /rosa +password quillmoor-admin +Rosa Quennick \(head cook\), admin/);
    assert.match(signIns[1], /tobin +password quillmoor-cook +Tobin Marrowfeld \(cook\), cook/);
    assert.match(signIns[2], /imke +password quillmoor-review +Imke Tressaly/);
    assert.equal(lines.at(-1), 'Stop with Ctrl+C.');
  });

  it('should say the demo edits its own copy of the formulas, not the checkout’s', () => {
    const text = startBanner(demo).join('\n');
    assert.match(
      text,
      /Formulas: +\/srv\/larder\/data\/formulas, a copy of the checkout's formulas\//,
    );
    assert.match(text, /never formulas\/ itself/);
    assert.match(text, /Records: +\/srv\/larder\/data\/larderbook\.sqlite/);
  });

  it('should not claim a copy when the demo is pointed at the checkout’s formulas', () => {
    const text = startBanner({
      ...demo,
      config: { ...demo.config, formulasDir: '/srv/larder/formulas' },
    }).join('\n');
    assert.match(text, /Formulas: +\/srv\/larder\/formulas; the console edits these files/);
  });

  it('should print no sign-ins in production, and say how to make the first admin', () => {
    const text = startBanner({
      ...demo,
      config: { ...demo.config, mode: 'production', kitchenName: 'the kitchen' },
      demoPeople: [],
      nobodyYet: true,
    }).join('\n');
    assert.doesNotMatch(text, /quillmoor|password|demo/i);
    assert.match(text, /larder users add USERNAME --role admin/);
  });
});
