import assert from 'node:assert/strict';
import { describe, it } from 'node:test';
import type { Locator, Page } from 'playwright-core';
import { readOutbox } from '../helpers/mail.ts';
import { collectConsoleErrors, dialogSettled, signIn, startConsole } from './browser.ts';

const WREN = {
  username: 'wren',
  displayName: 'Wren Ollivane',
  email: 'wren@quillmoor.invalid',
  password: 'hickory-bench-42',
};

/** The outbox row of the newest invitation to Wren, refreshed until it is kept (no mail server). */
async function keptInvitation(page: Page): Promise<Locator> {
  const row = page
    .getByTestId('outbox-row')
    .filter({ hasText: WREN.email })
    .and(page.locator('[data-kind="invitation"]'))
    .first();
  for (let i = 0; i < 20; i++) {
    await row.waitFor();
    if ((await row.getAttribute('data-state')) === 'kept') return row;
    await page.waitForTimeout(250);
    await page.getByTestId('outbox-refresh').click();
  }
  assert.fail('the invitation was never marked kept');
}

describe('mail in the console', () => {
  it('should invite a new person, let them set a password from the outbox link, choose reminders and download a batch sheet', async (t) => {
    const session = await startConsole(t);
    const { server } = session;

    // An admin adds Wren with an address: with no mail server, the add dialog shows the
    // invitation's link this once, to copy and pass on.
    const admin = await session.page('rosa');
    const adminErrors = collectConsoleErrors(admin);
    await admin.goto(`${server.url}/people`, { waitUntil: 'networkidle' });
    await admin.getByTestId('add-person').click();
    await dialogSettled(admin);
    await admin.getByTestId('person-username').fill(WREN.username);
    await admin.getByTestId('person-display-name').fill(WREN.displayName);
    await admin.getByTestId('person-email').fill(WREN.email);
    await admin.getByTestId('person-submit').click();
    const shown = admin.getByTestId('invitation-link');
    await shown.waitFor();
    const dialog = admin.getByTestId('add-person-dialog');
    assert.match(await dialog.innerText(), /Copy this link now: it is shown only once\./);
    const link = (await shown.innerText()).trim();
    assert.ok(link.startsWith(`${server.url}/set-password?token=`), link);
    const token = new URL(link).searchParams.get('token') ?? '';
    await admin.getByTestId('copy-invitation-link').waitFor();
    await session.screenshot(admin, 'person-invited');
    assert.equal(
      await admin.getByTestId('person-done').innerText(),
      'Done, I have the password and the link',
    );
    await admin.getByTestId('person-done').click();
    await admin.getByText(/pass them the invitation link you copied/).waitFor();

    // The outbox lists it, newest first, and says that nothing leaves this machine.
    await admin.getByTestId('tab-outbox').click();
    await admin.waitForURL(/\/people\/outbox$/);
    assert.match(
      await admin.getByTestId('outbox-transport').innerText(),
      /Kept here — no mail server is set up, so nothing is sent/,
    );
    const row = await keptInvitation(admin);
    const rowText = await row.innerText();
    assert.match(rowText, /Your Larderbook sign-in at Quillmoor Smokehouse/);
    assert.match(rowText, /Invitation/);
    assert.match(rowText, /Wren Ollivane/);
    // Nothing left this machine: the status says so, and never "Sent".
    assert.equal(await row.getByTestId('outbox-status').innerText(), 'Kept here');
    await session.screenshot(admin, 'outbox');

    // Opening it shows the text body only (no element of the HTML is rendered), without the
    // link's token, and says where the link went.
    await row.getByTestId('outbox-open').click();
    const body = admin.getByTestId('outbox-message-text');
    await body.waitFor();
    const text = await body.innerText();
    assert.match(text, /Hello Wren Ollivane,/);
    assert.equal(await body.evaluate((element) => element.children.length), 0);
    assert.ok(!text.includes(token), 'the outbox keeps no token');
    assert.match(text, /token=\(shown once to the admin who sent the invitation\)/);
    assert.match(
      await admin.getByTestId('outbox-link-note').innerText(),
      /shown once to the admin who sent the invitation/,
    );
    await session.screenshot(admin, 'outbox-message');
    await admin.getByRole('button', { name: 'Close' }).click();

    // Wren opens the link in a browser of their own, sets a password and signs in with it.
    const wren = await session.page();
    const wrenErrors = collectConsoleErrors(wren);
    await wren.goto(link, { waitUntil: 'networkidle' });
    const greeting = wren.getByTestId('set-password-for');
    await greeting.waitFor();
    assert.match(await greeting.innerText(), /For Wren Ollivane\. This link works until/);
    await wren.getByTestId('new-password').fill(WREN.password);
    await wren.getByTestId('repeat-password').fill(`${WREN.password}x`);
    await wren.getByTestId('set-password-submit').click();
    await wren.getByRole('alert').getByText('The two passwords differ.').waitFor();
    await wren.getByTestId('repeat-password').fill(WREN.password);
    await session.screenshot(wren, 'set-password');
    await wren.getByTestId('set-password-submit').click();
    await wren.waitForURL(/\/sign-in\?/);
    await wren.getByTestId('password-set').waitFor();
    assert.equal(await wren.getByLabel('Username').inputValue(), WREN.username);
    await wren.getByLabel('Password').fill(WREN.password);
    await wren.getByRole('button', { name: 'Sign in' }).click();
    await wren.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    const who = await wren.getByTestId('signed-in-as').innerText();
    assert.match(who, /Wren Ollivane/);
    assert.match(who, /Cook/);

    // The link works once: opened again, it says so and what to do.
    await wren.goto(link, { waitUntil: 'networkidle' });
    const refused = wren.getByTestId('set-password-refused');
    await refused.waitFor();
    assert.match(await refused.innerText(), /This invitation link has been used/);
    assert.match(await refused.innerText(), /re-send the invitation/);
    await session.screenshot(wren, 'set-password-used');

    // Wren turns turn-day reminders off; the choice is kept and audited.
    await wren.goto(`${server.url}/batches`, { waitUntil: 'networkidle' });
    await wren.getByRole('button', { name: 'Your account' }).click();
    await wren.getByRole('menuitem', { name: 'My reminders' }).click();
    await wren.getByTestId('my-reminders-address').getByText(WREN.email).waitFor();
    const flip = wren.getByRole('checkbox', { name: 'Turn days' });
    assert.equal(await flip.isChecked(), true, 'cooks get flip reminders by default');
    assert.equal(await wren.getByRole('checkbox', { name: 'Ready days' }).isChecked(), true);
    assert.equal(await wren.getByRole('checkbox', { name: 'Overdue batches' }).isChecked(), true);
    assert.match(
      await wren.getByTestId('my-reminders-basis').innerText(),
      /defaults for your role/,
    );
    // Process alerts (a reading overdue, a cooling deadline near, a limit missed): on for cooks.
    const alerts = wren.getByRole('checkbox', { name: 'Process alerts' });
    assert.equal(await alerts.isChecked(), true, 'cooks get process alerts by default');
    await flip.uncheck();
    await alerts.uncheck();
    await wren.getByTestId('my-reminders-defaults').waitFor();
    await session.screenshot(wren, 'my-reminders');
    await wren.getByTestId('my-reminders-save').click();
    const done = wren.getByTestId('my-reminders-done');
    await done.waitFor();
    assert.match(await done.innerText(), /You get ready-day and overdue reminders\./);
    assert.match(await done.innerText(), /You get no process alerts\./);
    await wren.getByRole('button', { name: 'Close' }).click();
    const audit = await server.as('rosa').get('/api/audit?action=reminder-choices');
    assert.equal(audit.json.events[0].subject, WREN.username);
    assert.deepEqual(audit.json.events[0].detail, {
      flip: false,
      ready: true,
      overdue: true,
      processAlerts: false,
    });
    await wren.getByRole('button', { name: 'Your account' }).click();
    await wren.getByRole('menuitem', { name: 'My reminders' }).click();
    await wren.getByTestId('my-reminders-basis').getByText('These are your own choices.').waitFor();
    assert.equal(await wren.getByRole('checkbox', { name: 'Turn days' }).isChecked(), false);
    assert.equal(await wren.getByRole('checkbox', { name: 'Process alerts' }).isChecked(), false);
    await wren.getByRole('button', { name: 'Cancel' }).click();

    // A batch page's Download PDF answers a PDF with the session's cookie, and nothing without.
    const batches = await server.as('rosa').get('/api/batches?limit=1');
    const lot = batches.json.items[0]?.lotCode as string;
    assert.ok(lot, 'the demo history has a batch');
    await wren.goto(`${server.url}/batches/${lot}`, { waitUntil: 'networkidle' });
    const download = wren.getByTestId('download-pdf');
    await download.waitFor();
    const href = await download.getAttribute('href');
    assert.equal(href, `/api/batches/${lot}/sheet.pdf`);
    const pdf = await wren.request.get(`${server.url}${href}`);
    assert.equal(pdf.status(), 200);
    assert.equal(pdf.headers()['content-type'], 'application/pdf');
    assert.equal((await pdf.body()).subarray(0, 5).toString('latin1'), '%PDF-');
    const [saved] = await Promise.all([wren.waitForEvent('download'), download.click()]);
    assert.equal(saved.suggestedFilename(), `${lot}.pdf`);
    assert.equal((await server.as('anonymous').get(href)).status, 401);
    await session.screenshot(wren, 'batch-page-download');

    // The admin sends Wren a new invitation from the list; the outbox then holds two.
    await admin.getByTestId('tab-people').click();
    await admin
      .getByTestId('person-row')
      .and(admin.locator(`[data-username="${WREN.username}"]`))
      .getByTestId('resend-invitation')
      .click();
    const resent = admin.getByTestId('invitation-link-dialog');
    await resent.waitFor();
    assert.match(await resent.innerText(), /Copy this link now: it is shown only once\./);
    const again = (await resent.getByTestId('invitation-link').innerText()).trim();
    assert.notEqual(again, link);
    assert.ok(again.startsWith(`${server.url}/set-password?token=`), again);
    await session.screenshot(admin, 'people-resend-invitation');
    await admin.keyboard.press('Escape');
    assert.equal(await resent.isVisible(), true, 'only the button closes it');
    await admin.getByTestId('invitation-done').click();
    await resent.waitFor({ state: 'detached' });
    const invitations = (await readOutbox(server)).filter(
      (message) => message.kind === 'invitation' && message.to === WREN.email,
    );
    assert.equal(invitations.length, 2);

    // The audit log words the invitations and Wren's reminder choices.
    await admin.getByTestId('tab-audit').click();
    const auditRow = (action: string) =>
      admin
        .getByTestId('audit-row')
        .and(admin.locator(`[data-action="${action}"]`))
        .first();
    await auditRow('invitation-send').waitFor();
    // No mail server in the demo: the invitation stayed in the outbox, and the log says so.
    assert.match(
      await auditRow('invitation-send').innerText(),
      /Kept an invitation \(no mail server\)/,
    );
    assert.doesNotMatch(await auditRow('invitation-send').innerText(), /Sent/);
    assert.match(await auditRow('invitation-send').innerText(), /to wren@quillmoor\.invalid/);
    assert.match(await auditRow('reminder-choices').innerText(), /Chose their reminders/);
    assert.match(await auditRow('reminder-choices').innerText(), /ready, overdue/);

    assert.deepEqual(adminErrors, []);
    // The used link's 410 is the one failure Wren's browser logs.
    assert.deepEqual(
      wrenErrors.filter((error) => !/status of 410/.test(error)),
      [],
    );
  });

  it('should say what to do when the link is unknown or missing', async (t) => {
    const session = await startConsole(t);
    const page = await session.page();
    await page.goto(`${session.server.url}/set-password?token=${'A'.repeat(43)}`, {
      waitUntil: 'networkidle',
    });
    const refused = page.getByTestId('set-password-refused');
    await refused.waitFor();
    assert.match(await refused.innerText(), /This invitation link is not known/);
    assert.match(await refused.innerText(), /whole link/);
    await page.goto(`${session.server.url}/set-password`, { waitUntil: 'networkidle' });
    await refused.getByText('This page needs the link from your invitation').waitFor();
    await page.getByRole('link', { name: 'Go to sign-in' }).click();
    await page.waitForURL(/\/sign-in/);
    await signIn(page, 'tobin');
  });
});
