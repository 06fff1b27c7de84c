import { readFile } from 'node:fs/promises';
import type { AuditPollDto } from '@veracast/shared-types';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserApp, type BrowserApp } from '../helpers/browser';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp({ demo: true });
});
afterAll(async () => app?.close());

/** Creates an audit of every demo election through the API, as the signed-in page's user. */
async function createAudit(page: Page): Promise<number> {
  const csrf = (await (await page.request.get('/api/v1/auth/csrf')).json()) as { csrfToken: string };
  const elections = (await (await page.request.get('/api/v1/elections')).json()) as { items: { key: string }[] };
  expect(elections.items.length).toBeGreaterThan(1);
  const response = await page.request.post('/api/v1/audits', {
    data: { name: 'Browser ranking audit', electionKeys: elections.items.map((e) => e.key) },
    headers: { 'X-CSRF-Token': csrf.csrfToken },
  });
  expect(response.status()).toBe(201);
  return ((await response.json()) as { id: number }).id;
}

async function firmNames(page: Page): Promise<string[]> {
  const table = page.getByRole('table', { name: 'Pollster ranking' });
  return (await table.locator('tbody tr').getByRole('link').allTextContents()).map((t) => t.trim()).sort();
}

describe('ranking, filters, firm page and a chart download in chromium', () => {
  it('opens the ranking, filters by mode, opens a firm page and downloads a chart’s CSV', async () => {
    const { page } = await app.signedInPage('analyst');
    const auditId = await createAudit(page);

    await page.goto(`/audits/${auditId}/rankings`);
    await page.getByRole('heading', { level: 1, name: /Pollster ranking: Browser ranking audit/ }).waitFor();
    await page.getByText('Fictional demo data').first().waitFor();
    await page.getByText(/Rankings from few polls are mostly luck/).waitFor();
    // A ranked firm with its intervals drawn inline, each read out as an image.
    const firstRow = page.getByRole('table', { name: 'Pollster ranking' }).locator('tbody tr').first();
    await firstRow.getByRole('img', { name: /^Rank [\d.]+ of \d+, 95% interval [\d.]+ to [\d.]+$/ }).waitFor();
    await expect(firstRow.getByRole('img', { name: /^Excess error .+ points, 95% interval .+ to .+$/ }).count()).resolves.toBe(1);
    const allFirms = await firmNames(page);

    // Which firms the audit used phone polls of, from the API: the filtered ranking must list exactly those.
    const polls = (await (await page.request.get(`/api/v1/audits/${auditId}/polls?used=true`)).json()) as { items: AuditPollDto[] };
    const phoneFirms = [...new Set(polls.items.filter((p) => p.mode === 'phone').map((p) => p.pollster))].sort();
    expect(phoneFirms.length).toBeGreaterThan(0);
    expect(phoneFirms.length).toBeLessThan(allFirms.length);

    // The checkbox reflects the page address, which updates a moment after the click: click once and
    // wait for the address rather than asking playwright to see the box change at once.
    await page.getByLabel('Phone', { exact: true }).click();
    await page.waitForURL((url) => url.searchParams.get('modes') === 'phone');
    await expect.poll(() => page.getByLabel('Phone', { exact: true }).isChecked()).toBe(true);
    await page.getByText(`${phoneFirms.length} firms listed.`).waitFor();
    await page.getByRole('table', { name: 'Pollster ranking' }).locator('tbody tr').nth(phoneFirms.length - 1).waitFor();
    const filtered = await firmNames(page);
    expect(filtered).toEqual(phoneFirms);
    expect(filtered).not.toEqual(allFirms);

    // The firm page from the table.
    const firm = filtered[0]!;
    await page.getByRole('table', { name: 'Pollster ranking' }).getByRole('link', { name: firm, exact: true }).click();
    await page.waitForURL((url) => /^\/pollsters\/\d+\/accuracy$/.test(url.pathname) && url.searchParams.get('audit') === String(auditId));
    await page.getByRole('heading', { name: 'Lean per election: the firm against the field' }).waitFor();
    await page.getByRole('heading', { name: 'Accuracy in this audit' }).waitFor();

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Download CSV of Lean per election: the firm against the field' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/lean-per-election\.csv$/);
    const text = (await readFile((await download.path())!, 'utf8')).replace(/^\uFEFF/, '');
    const [header, ...rows] = text.split('\r\n').filter(Boolean);
    const columns = header!.split(',');
    expect(columns).toEqual([
      'electionKey', 'election', 'blocA', 'blocB', 'firmPolls', 'firmSignedPolls', 'firmMeanSignedError', 'firmMeanAbsError',
      'fieldPolls', 'fieldMeanSignedError', 'fieldMeanAbsError', 'firmMinusField',
    ]);
    expect(rows.length).toBeGreaterThan(0);
    const abs = columns.indexOf('firmMeanAbsError');
    const polled = columns.indexOf('firmPolls');
    // Election names hold no commas, so a plain split finds the cells.
    const numeric = rows.map((row) => row.split(',')).filter((cells) => Number(cells[polled]) > 0 && Number.isFinite(Number(cells[abs])) && cells[abs] !== '');
    expect(numeric.length).toBeGreaterThan(0);
    expect(Number(numeric[0]![abs])).toBeGreaterThanOrEqual(0);
  });
});
