import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { startBrowserApp, type BrowserApp } from '../helpers/browser';
import { buildPoll, pollsCsv, resultsCsv } from '../helpers/factories';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp();
});
afterAll(async () => app?.close());

/** Calls the API from a signed-in page (its cookie plus the CSRF header). */
async function api(page: Page, url: string, body: { json?: object; file?: Buffer }) {
  const csrf = ((await (await page.request.get('/api/v1/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
  const res = body.file
    ? await page.request.post(url, { headers: { 'X-CSRF-Token': csrf }, multipart: { file: { name: 'data.csv', mimeType: 'text/csv', buffer: body.file } } })
    : await page.request.post(url, { headers: { 'X-CSRF-Token': csrf }, data: body.json });
  expect(res.status(), `${url}: ${await res.text()}`).toBeLessThan(300);
  return res.json() as Promise<{ id: number; dataHash: string }>;
}

const shot = (page: Page, name: string) => page.screenshot({ path: `/tmp/notes-${name}.png`, fullPage: true }).catch(() => undefined);

describe('writing, reviewing and publishing a note in the browser', () => {
  it('an analyst writes a note with a scorecard block and submits it; another user approves; the public page opens signed out', async () => {
    const analyst = await app.signedInPage('analyst');
    const reviewer = await app.signedInPage('reviewer');
    await api(reviewer.page, '/api/v1/imports/results', { file: resultsCsv() });
    const polls = [
      ...buildPoll({ poll_key: 'a-nat' }),
      ...buildPoll({ poll_key: 'a-north', contest_key: 'tst-2030-north' }, { red: 38, blue: 55, green: 5, undecided: 2 }),
      ...buildPoll({ poll_key: 'b-nat', pollster: 'Beta Polling' }, { red: 49, blue: 43, green: 6, undecided: 2 }),
      ...buildPoll({ poll_key: 'b-north', pollster: 'Beta Polling', contest_key: 'tst-2030-north' }, { red: 41, blue: 50, green: 7, undecided: 2 }),
    ];
    await api(analyst.page, '/api/v1/imports/polls', { file: pollsCsv(polls) });
    const audit = await api(analyst.page, '/api/v1/audits', { json: { name: 'Browser audit 2030', electionKeys: ['tst-2030-general'] } });

    const page = analyst.page;
    await page.goto('/notes');
    await page.getByRole('link', { name: 'New note' }).click();
    await page.getByLabel('Title', { exact: true }).fill('How the 2030 polls did');
    await page.getByRole('button', { name: 'Create draft' }).click();
    await page.waitForURL(/\/notes\/\d+\/edit$/);
    const noteId = Number(/\/notes\/(\d+)\/edit/.exec(page.url())![1]);

    const editor = page.getByLabel('Markdown', { exact: true });
    await editor.fill('# How the 2030 polls did\n\nThe firms compared on the same contests:\n');
    await editor.press('End');
    await page.getByLabel('Audit', { exact: true }).selectOption(String(audit.id));
    await page.getByLabel('View', { exact: true }).selectOption('scorecard');
    await page.getByRole('button', { name: 'Insert block' }).click();
    await expect.poll(() => editor.inputValue()).toContain(`audit: ${audit.id}\nview: scorecard`);
    const preview = page.getByLabel('Preview of the note');
    await preview.getByText(`Pollster scorecards — audit #${audit.id}`).waitFor();
    await preview.getByRole('cell', { name: 'Beta Polling' }).waitFor();
    await shot(page, 'editor');

    await page.getByRole('button', { name: 'Save version' }).click();
    await page.getByText(/Saved as version 2/).waitFor();
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(new RegExp(`/notes/${noteId}$`));
    await page.getByText('In review', { exact: true }).first().waitFor();
    // The author sees no approval controls on their own note.
    expect(await page.getByRole('button', { name: 'Approve and publish' }).count()).toBe(0);

    const r = reviewer.page;
    await r.goto(`/notes/${noteId}`);
    await r.getByRole('heading', { name: 'How the 2030 polls did', level: 1 }).waitFor();
    await r.getByText(`Pollster scorecards — audit #${audit.id}`).waitFor();
    await r.getByLabel('Review comments').fill('Clear and complete.');
    await shot(r, 'review');
    await r.getByRole('button', { name: 'Approve and publish' }).click();
    await r.getByText('Published', { exact: true }).first().waitFor();
    const publicHref = await r.getByRole('link', { name: 'Public page' }).getAttribute('href');
    expect(publicHref).toBe('/public/notes/how-the-2030-polls-did');

    const visitor = await app.newPage();
    await visitor.goto(publicHref!);
    await visitor.getByRole('heading', { name: 'How the 2030 polls did', level: 1 }).first().waitFor();
    await visitor.getByText(`Pollster scorecards — audit #${audit.id}`).waitFor();
    await visitor.getByRole('cell', { name: 'Beta Polling' }).waitFor();
    await visitor.getByText(audit.dataHash).first().waitFor();
    await visitor.getByRole('heading', { name: 'Reading these figures' }).waitFor();
    await visitor.getByText(/covers the sampling error of one share only/).waitFor();
    await visitor.getByText(/not a forecast/).waitFor();
    await visitor.getByRole('heading', { name: 'Correction history' }).waitFor();
    expect(await visitor.getByRole('link', { name: 'Download as PDF' }).getAttribute('href')).toBe('/api/v1/public/notes/how-the-2030-polls-did/pdf');
    expect(new URL(visitor.url()).pathname).toBe('/public/notes/how-the-2030-polls-did');
    expect(await visitor.getByRole('link', { name: 'Sign out' }).count()).toBe(0);
    await shot(visitor, 'public');
    const pdf = await visitor.request.get('/api/v1/public/notes/how-the-2030-polls-did/pdf');
    expect(pdf.headers()['content-type']).toBe('application/pdf');
  });
});
