import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserApp, type BrowserApp } from '../helpers/browser';

const DEMO_ELECTIONS = [
  'almerand-2014-general',
  'almerand-2018-general',
  'almerand-2020-referendum',
  'almerand-2022-general',
  'almerand-2026-general',
];

let app: BrowserApp;
let page: Page;
let auditId: number;

beforeAll(async () => {
  app = await startBrowserApp({ demo: true });
  ({ page } = await app.signedInPage('analyst'));
  const csrf = await page.request.get('/api/v1/auth/csrf');
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const created = await page.request.post('/api/v1/audits', {
    data: { name: 'Shared-error browser audit', electionKeys: DEMO_ELECTIONS },
    headers: { 'X-CSRF-Token': csrfToken },
  });
  expect(created.status()).toBe(201);
  auditId = ((await created.json()) as { id: number }).id;
});
afterAll(async () => app?.close());

async function screenshotOnFailure<T>(name: string, run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    await page.screenshot({ path: `/tmp/${name}.png`, fullPage: true }).catch(() => undefined);
    throw error;
  }
}

const allText = async () => (await page.locator('body').textContent()) ?? '';

describe('the shared-error page in the browser', () => {
  it('flags the demo election with the large shared miss, with a negative size and its blocs', async () => {
    await screenshotOnFailure('shared-error-2022', async () => {
      await page.goto(`/audits/${auditId}/shared-error/almerand-2022-general`);
      const flag = page.getByRole('region', { name: 'Shared miss: most firms missed the same way' });
      await flag.waitFor();
      const text = (await flag.textContent()) ?? '';
      // [practice] the demo scenario was generated so that most firms understated OAK against LAN in 2022
      expect(text).toContain('polls understated OAK against LAN');
      const mean = /mean signed error ([+\u2212-]?)(\d+\.\d) pts/.exec(text);
      expect(mean).not.toBeNull();
      const size = Number(mean?.[2]) * (mean?.[1] === '\u2212' || mean?.[1] === '-' ? -1 : 1);
      expect(size).toBeLessThan(-1);
      expect(await page.getByText('Fictional demo data').count()).toBeGreaterThan(0);
      // the evidence and the poll-average blocks are on the page too
      await page.getByRole('heading', { name: 'Each poll’s error around its contest’s mean' }).waitFor();
      await page.getByRole('heading', { name: 'Effective polls and honest intervals' }).waitFor();
      expect(await allText()).not.toMatch(/NaN/);
    });
  });

  it('downloads a chart as SVG and PNG and its data as CSV', async () => {
    await screenshotOnFailure('shared-error-downloads', async () => {
      const read = async (name: string) => {
        const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name }).click()]);
        const stream = await download.createReadStream();
        const chunks: Buffer[] = [];
        for await (const chunk of stream) chunks.push(chunk as Buffer);
        return { filename: download.suggestedFilename(), body: Buffer.concat(chunks) };
      };
      const svg = await read('Download Where the error came from as SVG');
      expect(svg.filename).toBe(`audit-${auditId}-almerand-2022-general-variance-split.svg`);
      expect(svg.body.toString('utf8')).toContain('<svg');
      expect(svg.body.toString('utf8')).toContain('Shared (contest)');
      const png = await read('Download Where the error came from as PNG');
      // [published] PNG files start with the 8-byte signature 89 50 4E 47 0D 0A 1A 0A (PNG spec, ISO/IEC 15948)
      expect([...png.body.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
      const csv = await read('Download the data of Where the error came from as CSV');
      expect(csv.body.toString('utf8').replace(/^\uFEFF/, '').split('\r\n')[0]).toBe('part,share,variance_estimate_pts2');
    });
  });

  it('shows another election without any NaN on the page', async () => {
    await screenshotOnFailure('shared-error-2018', async () => {
      await page.getByLabel('Election', { exact: true }).selectOption('almerand-2018-general');
      await page.waitForURL((u) => u.pathname.endsWith('/shared-error/almerand-2018-general'));
      await page.getByRole('heading', { name: 'Shared error: Almerand general election 2018' }).waitFor();
      await page.getByRole('heading', { name: 'Do firms’ errors move together?' }).waitFor();
      await page.getByRole('heading', { name: 'The interval each poll average should have carried' }).waitFor();
      expect(await page.getByRole('region', { name: 'Shared miss: most firms missed the same way' }).count()).toBe(0);
      const text = await allText();
      expect(text).not.toMatch(/NaN/);
      expect(text).not.toMatch(/\bundefined\b/);
    });
  });

  it('answers the referendum, with a single contest, in words rather than NaN', async () => {
    await screenshotOnFailure('shared-error-2020', async () => {
      await page.goto(`/audits/${auditId}/shared-error/almerand-2020-referendum`);
      await page.getByRole('region', { name: 'No test of a shared miss: too few contests' }).waitFor();
      const text = await allText();
      expect(text).toContain('not enough data');
      expect(text).not.toMatch(/NaN/);
    });
  });

  it('shows the across-elections history with the too-close contests', async () => {
    await screenshotOnFailure('shared-error-history', async () => {
      await page.goto(`/audits/${auditId}/history`);
      await page.getByRole('heading', { name: 'The shared miss, election by election' }).waitFor();
      const card = page.getByRole('region', { name: 'Contests too close for polls to call' });
      await card.waitFor();
      expect((await card.textContent()) ?? '').toMatch(/\d+ of \d+ contests/);
      expect(await allText()).not.toMatch(/NaN/);
    });
  });
});
