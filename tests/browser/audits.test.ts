import type { Locator, Page } from 'playwright-core';
import { CSRF_HEADER, type AuditDto, type AuditPollDto, type ListResponse } from '@veracast/shared-types';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserApp, type BrowserApp } from '../helpers/browser';

let app: BrowserApp;
let analyst: Page;
let auditId = 0;

beforeAll(async () => {
  app = await startBrowserApp({ demo: true });
  ({ page: analyst } = await app.signedInPage('analyst'));
});
afterAll(async () => app?.close());

/** Numbers as the audit screens print them: a true minus sign, a plus sign, a unit. */
function shownNumber(text: string): number {
  return Number(text.replace('\u2212', '-').replace(/[+%\s]|pts/g, ''));
}

async function columnValues(table: Locator, heading: RegExp, rows: number): Promise<number[]> {
  const headings = await table.getByRole('columnheader').allTextContents();
  const index = headings.findIndex((text) => heading.test(text));
  expect(index, `a column headed ${heading}`).toBeGreaterThanOrEqual(0);
  const cells = table.locator('tbody tr').locator(`td:nth-child(${index + 1})`);
  const texts = (await cells.allTextContents()).slice(0, rows);
  return texts.map(shownNumber);
}

async function apiGet<T>(page: Page, path: string): Promise<T> {
  const response = await page.request.get(`/api/v1${path}`);
  expect(response.status()).toBe(200);
  return (await response.json()) as T;
}

describe('audits in the browser', () => {
  it('an analyst creates an audit, reads its headline and sorts the per-poll table by absolute error', async () => {
    await analyst.getByRole('navigation').getByRole('link', { name: 'Audits' }).click();
    await analyst.getByRole('link', { name: 'New audit' }).click();
    await analyst.getByLabel('Audit name').fill('Browser audit of 2018 and 2022');
    await analyst.getByRole('checkbox', { name: /Almerand general election 2018/ }).check();
    await analyst.getByRole('checkbox', { name: /Almerand general election 2022/ }).check();
    await analyst.getByRole('button', { name: 'Create audit' }).click();
    await analyst.waitForURL(/\/audits\/\d+$/, { timeout: 60_000 });
    auditId = Number(new URL(analyst.url()).pathname.split('/').pop());

    await analyst.getByRole('heading', { level: 1, name: 'Browser audit of 2018 and 2022' }).waitFor();
    await analyst.getByText('Fictional demo data').first().waitFor();

    // The headline on screen is the server's, rounded to two decimals [practice: formatPoints].
    const audit = await apiGet<AuditDto>(analyst, `/audits/${auditId}`);
    expect(audit.settings.electionKeys.sort()).toEqual(['almerand-2018-general', 'almerand-2022-general']);
    expect(audit.headline.pollsUsed).toBeGreaterThan(10);
    for (const label of ['Polls used', 'Mean absolute margin error', 'Mean signed error', 'Margin interval coverage', 'Winner called']) {
      await analyst.getByRole('term').filter({ hasText: label }).waitFor();
    }
    await analyst.getByText(`${audit.headline.meanAbsMarginError!.toFixed(2)} pts`, { exact: true }).waitFor();
    await analyst.getByText(audit.dataHash, { exact: true }).waitFor();

    const table = analyst.getByRole('table', { name: 'Per-poll metrics of the audit' });
    await table.locator('tbody tr').first().waitFor();
    const used = await apiGet<ListResponse<AuditPollDto>>(analyst, `/audits/${auditId}/polls?used=true`);
    const errors = used.items.map((p) => p.absMarginError!).sort((a, b) => a - b);
    // The table's default view holds exactly the polls the server counts as used.
    expect(used.total).toBe(audit.headline.pollsUsed);
    await analyst.getByText(new RegExp(`^Rows 1–\\d+ of ${used.total} \\(`)).waitFor();

    const heading = table.getByRole('columnheader', { name: /Abs\. margin error/ });
    await heading.getByRole('button').click();
    expect(await heading.getAttribute('aria-sort')).toBe('ascending');
    const ascending = await columnValues(table, /Abs\. margin error/, 15);
    expect(ascending).toHaveLength(15);
    for (let i = 1; i < ascending.length; i++) expect(ascending[i]!).toBeGreaterThanOrEqual(ascending[i - 1]!);
    // The first row is the smallest miss among the used polls the API lists.
    expect(ascending[0]).toBeCloseTo(errors[0]!, 2);

    await heading.getByRole('button').click();
    expect(await heading.getAttribute('aria-sort')).toBe('descending');
    const descending = await columnValues(table, /Abs\. margin error/, 15);
    for (let i = 1; i < descending.length; i++) expect(descending[i]!).toBeLessThanOrEqual(descending[i - 1]!);
    expect(descending[0]).toBeCloseTo(errors[errors.length - 1]!, 2);
  });

  it('says when the data has changed and re-runs the audit on the current data', async () => {
    expect(auditId).toBeGreaterThan(0);
    const csv = [
      'poll_key,pollster,sponsor,contest_key,fieldwork_start,fieldwork_end,published_on,sample_size,population,mode,moe,option_key,share',
      ...Object.entries({ lantern: 36, oak: 33, tidewater: 11, verdant: 8, forward: 6, farmers: 4, undecided: 2 }).map(
        ([option, share]) =>
          `browser-extra-2018-p1,Browser Test Polling,,almerand-2018-general-national,2018-05-01,2018-05-05,2018-05-07,1000,lv,online,3.1,${option},${share}`,
      ),
    ].join('\n');
    const { csrfToken } = await apiGet<{ csrfToken: string }>(analyst, '/auth/csrf');
    const imported = await analyst.request.post('/api/v1/imports/polls', {
      headers: { [CSRF_HEADER]: csrfToken },
      multipart: { file: { name: 'extra-poll.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) } },
    });
    expect(imported.status(), await imported.text()).toBe(201);

    await analyst.goto(`/audits/${auditId}`);
    await analyst.getByText('This audit is out of date').waitFor();
    await analyst.getByRole('button', { name: 'Re-run with current data' }).click();
    await analyst.waitForURL((url) => /\/audits\/\d+$/.test(url.pathname) && url.pathname !== `/audits/${auditId}`, { timeout: 60_000 });
    const rerunId = Number(new URL(analyst.url()).pathname.split('/').pop());

    const rerun = await apiGet<AuditDto>(analyst, `/audits/${rerunId}`);
    expect(rerun.rerunOf).toBe(auditId);
    expect(rerun.outOfDate).toBe(false);
    await analyst.getByRole('link', { name: `audit ${auditId}`, exact: true }).waitFor();
    expect(await analyst.getByText('This audit is out of date').count()).toBe(0);
    // The new poll is in the re-run and not in the frozen original.
    const polls = await apiGet<ListResponse<AuditPollDto>>(analyst, `/audits/${rerunId}/polls?election=almerand-2018-general`);
    expect(polls.items.some((p) => p.pollKey === 'browser-extra-2018-p1')).toBe(true);
    const before = await apiGet<ListResponse<AuditPollDto>>(analyst, `/audits/${auditId}/polls?election=almerand-2018-general`);
    expect(before.items.some((p) => p.pollKey === 'browser-extra-2018-p1')).toBe(false);
  });

  it('a viewer reads audits but is offered no way to create one', async () => {
    const { page: viewer } = await app.signedInPage('viewer');
    await viewer.goto('/audits');
    await viewer.getByRole('link', { name: 'Browser audit of 2018 and 2022' }).first().waitFor();
    expect(await viewer.getByRole('link', { name: 'New audit' }).count()).toBe(0);
    await viewer.goto(`/audits/${auditId}`);
    await viewer.getByRole('term').filter({ hasText: 'Polls used' }).waitFor();
    await viewer.getByText('This audit is out of date').waitFor();
    expect(await viewer.getByRole('button', { name: 'Re-run with current data' }).count()).toBe(0);
    await viewer.goto('/audits/new');
    await viewer.getByText(/do not have access/i).waitFor();
  });
});
