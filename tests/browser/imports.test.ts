import type { ContestDto, PollDto } from '@veracast/shared-types';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserApp, type BrowserApp } from '../helpers/browser';

const CONTEST = 'almerand-2022-general-national';
const HEADER = 'poll_key,pollster,sponsor,contest_key,fieldwork_start,fieldwork_end,published_on,sample_size,population,mode,moe,option_key,share';

let app: BrowserApp;
beforeAll(async () => {
  app = await startBrowserApp({ demo: true });
});
afterAll(async () => app?.close());

/** Two polls of the demo contest in the long layout; `sampleB` is the second poll's sample size cell. */
function pollsCsv(options: { keyPrefix: string; a: string; b: string; sampleB: string; sampleHeader?: string }): string {
  const header = options.sampleHeader ? HEADER.replace('sample_size', options.sampleHeader) : HEADER;
  const poll = (key: string, sample: string, shareA: number, shareB: number) =>
    [
      [key, 'Harbourlight Opinion', 'Browser Test Daily', CONTEST, '2022-05-01', '2022-05-04', '2022-05-06', sample, 'lv', 'online', '3.1', options.a, shareA],
      [key, 'Harbourlight Opinion', 'Browser Test Daily', CONTEST, '2022-05-01', '2022-05-04', '2022-05-06', sample, 'lv', 'online', '3.1', options.b, shareB],
      [key, 'Harbourlight Opinion', 'Browser Test Daily', CONTEST, '2022-05-01', '2022-05-04', '2022-05-06', sample, 'lv', 'online', '3.1', 'undecided', 12],
    ].map((cells) => cells.join(','));
  return [header, ...poll(`${options.keyPrefix}-a`, '1200', 36, 31), ...poll(`${options.keyPrefix}-b`, options.sampleB, 35, 33)].join('\n') + '\n';
}

async function contestOptions(page: Page): Promise<[string, string]> {
  const response = await page.request.get(`/api/v1/contests/${CONTEST}`);
  expect(response.status()).toBe(200);
  const contest = (await response.json()) as ContestDto;
  const [first, second] = contest.options.map((o) => o.key);
  expect(first).toBeTruthy();
  expect(second).toBeTruthy();
  return [first!, second!];
}

async function chooseFile(page: Page, name: string, text: string) {
  await page.getByLabel('CSV file').setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(text, 'utf8') });
  await page.getByRole('table', { name: `Preview of ${name}` }).waitFor();
}

describe('importing polls through the browser', () => {
  it('shows the bad row with its row and column, imports the corrected file and lists the poll on its contest page', async () => {
    const { page } = await app.signedInPage('analyst');
    const [a, b] = await contestOptions(page);

    await page.getByRole('link', { name: 'Imports' }).click();
    await page.getByRole('heading', { name: 'Imports', level: 1 }).waitFor();
    await page.getByRole('radio', { name: /^Polls/ }).check();

    // The second poll's sample size is not a number: its first row is spreadsheet row 5
    // (header row 1, poll a on rows 2–4). [practice] SPEC §3 row numbering
    await chooseFile(page, 'polls-bad.csv', pollsCsv({ keyPrefix: 'browser-imp', a, b, sampleB: 'abc' }));
    await page.getByRole('button', { name: 'Check (dry run)' }).click();
    const errors = page.getByRole('table', { name: 'Row errors found by the check' });
    await errors.waitFor();
    const errorRow = errors.getByRole('row').filter({ hasText: 'sample_size' });
    expect(await errorRow.count()).toBe(1);
    const cells = await errorRow.getByRole('cell').allInnerTexts();
    expect(cells[0]).toBe('5');
    expect(cells[1]).toBe('sample_size');
    expect(cells[3]).toContain('abc');
    await page.getByText(/nothing was written/).first().waitFor();
    // With errors the whole file cannot be imported; only the explicit valid-rows choice is offered.
    expect(await page.getByRole('button', { name: 'Import', exact: true }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Import valid rows only' }).count()).toBe(1);

    // Nothing was written by the check.
    expect((await page.request.get('/api/v1/polls/browser-imp-a')).status()).toBe(404);

    await chooseFile(page, 'polls-fixed.csv', pollsCsv({ keyPrefix: 'browser-imp', a, b, sampleB: '950' }));
    await page.getByRole('button', { name: 'Check (dry run)' }).click();
    await page.getByText('Dry run: the file is valid').waitFor();
    // The firm is unknown to the demo, so the check offers to map it or create it.
    await page.getByLabel('Firm for “Harbourlight Opinion”').waitFor();
    await page.getByRole('button', { name: 'Import', exact: true }).click();
    await page.getByRole('heading', { name: 'Import finished' }).waitFor();
    await page.getByText('2 polls created').waitFor();

    await page.getByRole('link', { name: CONTEST }).click();
    await page.waitForURL((u) => u.pathname === `/contests/${CONTEST}`);
    await page.getByLabel('Search polls').fill('browser-imp');
    const polls = page.getByRole('table', { name: /^Polls of / });
    await polls.getByRole('link', { name: 'browser-imp-b' }).waitFor();
    expect(await polls.getByRole('link', { name: 'browser-imp-a' }).count()).toBe(1);

    const stored = (await (await page.request.get('/api/v1/polls/browser-imp-b')).json()) as PollDto;
    expect(stored.sampleSize).toBe(950);
    expect(stored.pollster).toBe('Harbourlight Opinion');

    const history = (await (await page.request.get('/api/v1/imports')).json()) as { items: { fileName: string; status: string; errorCount: number }[] };
    expect(history.items.find((i) => i.fileName === 'polls-bad.csv')).toMatchObject({ status: 'failed', errorCount: 1 });
    expect(history.items.find((i) => i.fileName === 'polls-fixed.csv' && i.status === 'committed')).toBeTruthy();
  });

  it('asks for a column the file names differently and imports once it is mapped', async () => {
    const { page } = await app.signedInPage('analyst');
    const [a, b] = await contestOptions(page);
    await page.goto('/imports');
    await page.getByRole('radio', { name: /^Polls/ }).check();
    await chooseFile(page, 'polls-interviews.csv', pollsCsv({ keyPrefix: 'browser-map', a, b, sampleB: '800', sampleHeader: 'interviews' }));

    await page.getByText('Choose the file column for sample_size.').waitFor();
    expect(await page.getByRole('button', { name: 'Check (dry run)' }).isDisabled()).toBe(true);
    await page.getByLabel('File column for sample_size').selectOption('interviews');
    await page.getByRole('button', { name: 'Check (dry run)' }).click();
    await page.getByText('Dry run: the file is valid').waitFor();
    await page.getByRole('button', { name: 'Import', exact: true }).click();
    await page.getByRole('heading', { name: 'Import finished' }).waitFor();

    const stored = (await (await page.request.get('/api/v1/polls/browser-map-b')).json()) as PollDto;
    expect(stored.sampleSize).toBe(800);
  });

  it('maps the option columns of a wide file to the contest options and imports it', async () => {
    const { page } = await app.signedInPage('analyst');
    const response = await page.request.get(`/api/v1/contests/${CONTEST}`);
    const contest = (await response.json()) as ContestDto;
    const [first, second] = contest.options;
    expect(first && second).toBeTruthy();
    // One column named after an option's name, one after a key, a "DK" column and a note column.
    const header = `poll_key,pollster,sponsor,contest_key,fieldwork_start,fieldwork_end,published_on,sample_size,population,mode,moe,${first!.name},${second!.key},DK,Notes`;
    const row = `browser-wide-1,Harbourlight Opinion,,${CONTEST},2022-05-01,2022-05-03,2022-05-05,1000,lv,phone,3,37,31,12,checked twice`;
    await page.goto('/imports');
    await chooseFile(page, 'polls-wide.csv', `${header}\n${row}\n`);

    expect(await page.getByRole('radio', { name: /^Wide/ }).isChecked()).toBe(true);
    const optionFor = (column: string) => page.getByLabel(`Option held by file column ${column}`);
    await expect.poll(() => optionFor(first!.name).inputValue()).toBe(first!.key);
    expect(await optionFor(second!.key).inputValue()).toBe(second!.key);
    expect(await optionFor('DK').inputValue()).toBe('undecided');
    expect(await optionFor('Notes').inputValue()).toBe('');

    await page.getByRole('button', { name: 'Check (dry run)' }).click();
    await page.getByText('Dry run: the file is valid').waitFor();
    await page.getByRole('button', { name: 'Import', exact: true }).click();
    await page.getByRole('heading', { name: 'Import finished' }).waitFor();
    const stored = (await (await page.request.get('/api/v1/polls/browser-wide-1')).json()) as PollDto;
    expect(stored.shares).toEqual({ [first!.key]: 37, [second!.key]: 31, undecided: 12 });
  });
});
