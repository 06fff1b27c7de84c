import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestApp, waitForMail, type SignedInAgent, type TestApp } from '../helpers/test-app';
import { buildPoll, buildResults, pollsCsv, resultsCsv } from '../helpers/factories';
import { parseHtml, type HtmlElement } from '../../backend/src/services/notes/html-tree';

let t: TestApp;
let author: SignedInAgent;
let otherAnalyst: SignedInAgent;
let reviewer: SignedInAgent;
let reviewer2: SignedInAgent;
let admin: SignedInAgent;
let viewer: SignedInAgent;
let auditId: number;
let dataHash: string;

/*
 * The small archive: national red 48 / blue 45 (certified), north red 40 / blue 52; one Alpha
 * Research poll in each contest, 11 days out. Orientation blocs RED (520,000 votes) over BLUE
 * (502,000). Margin errors [computed by hand with SPEC §4, e = (pA − pB) − (VA − VB)]:
 * national (46 − 44) − (48 − 45) = −1; north (38 − 55) − (40 − 52) = −5; mean |e| = 3.00.
 */
const STORED_MEAN_ABS = '3.00';
/*
 * After the recount (north red 40,000 → 41,000 of 101,000 votes) the north error becomes
 * −17 − (40.594059 − 51.485149) = −6.108911 and a fresh audit's mean |e| is (1 + 6.108911)/2 =
 * 3.554455 [computed by hand with the same formula].
 */
const RECOUNTED_MEAN_ABS = '3.55';

const block = (view: string, extra = '') => `\`\`\`veracast\naudit: ${auditId}\nview: ${view}\n${extra}\`\`\`\n`;
const noteMarkdown = () => `# What the 2030 polls missed\n\nThe mean miss was small: $e = (p_A - p_B) - (V_A - V_B)$.\n\n${block('headline')}\n${block('scorecard')}\n\`\`\`veracast\nview: methods\n\`\`\`\n`;

async function createNote(agent: SignedInAgent, title: string, markdown = noteMarkdown()) {
  const res = await agent.post('/api/v1/notes').send({ title, markdown, electionKey: 'tst-2030-general' }).expect(201);
  return res.body as { id: number; slug: string };
}

async function publishedNote(title: string, markdown = noteMarkdown()) {
  const note = await createNote(author, title, markdown);
  await author.post(`/api/v1/notes/${note.id}/submit`).expect(200);
  await reviewer.post(`/api/v1/notes/${note.id}/publish`).send({}).expect(200);
  return note;
}

beforeAll(async () => {
  t = await createTestApp();
  [author, otherAnalyst, reviewer, reviewer2, admin, viewer] = await Promise.all([
    t.signIn('analyst'), t.signIn('analyst'), t.signIn('reviewer'), t.signIn('reviewer'), t.signIn('admin'), t.signIn('viewer'),
  ]);
  await reviewer.post('/api/v1/imports/results').attach('file', resultsCsv(), 'results.csv').expect(201);
  const polls = [
    ...buildPoll({ poll_key: 'n-1' }),
    ...buildPoll({ poll_key: 'r-1', contest_key: 'tst-2030-north' }, { red: 38, blue: 55, green: 5, undecided: 2 }),
  ];
  await author.post('/api/v1/imports/polls').attach('file', pollsCsv(polls), 'polls.csv').expect(201);
  const audit = await author.post('/api/v1/audits').send({ name: 'Test 2030 audit', electionKeys: ['tst-2030-general'] }).expect(201);
  auditId = audit.body.id;
  dataHash = audit.body.dataHash;
});
afterAll(async () => t.close());

describe('who may call each notes route', () => {
  const signedOut: Array<[method: 'get' | 'post' | 'put', url: string]> = [
    ['get', '/api/v1/notes'], ['post', '/api/v1/notes'], ['post', '/api/v1/notes/preview'], ['get', '/api/v1/notes/1'], ['put', '/api/v1/notes/1'],
    ['get', '/api/v1/notes/1/versions'], ['get', '/api/v1/notes/1/versions/1'], ['post', '/api/v1/notes/1/submit'], ['post', '/api/v1/notes/1/return'],
    ['post', '/api/v1/notes/1/publish'], ['post', '/api/v1/notes/1/corrections'],
  ];
  it.each(signedOut)('%s %s: 401 signed out', async (method, url) => {
    const res = await request(t.app)[method](url).send({});
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
  });

  const viewerRefused: Array<[method: 'post' | 'put', url: string]> = [
    ['post', '/api/v1/notes'], ['post', '/api/v1/notes/preview'], ['put', '/api/v1/notes/1'], ['post', '/api/v1/notes/1/submit'],
    ['post', '/api/v1/notes/1/return'], ['post', '/api/v1/notes/1/publish'], ['post', '/api/v1/notes/1/corrections'],
  ];
  it.each(viewerRefused)('%s %s: 403 for a viewer (a viewer cannot write)', async (method, url) => {
    const res = await viewer[method](url).send({ title: 'x', markdown: 'x', notice: 'x', comments: 'x' });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/needs the (analyst|reviewer) role/);
  });

  it.each([['return'], ['publish']])('POST /notes/:id/%s: 403 for an analyst', async (action) => {
    const note = await createNote(author, `Analyst cannot ${action}`);
    await author.post(`/api/v1/notes/${note.id}/submit`).expect(200);
    const res = await otherAnalyst.post(`/api/v1/notes/${note.id}/${action}`).send({ comments: 'looks fine' }).expect(403);
    expect(res.body.error.message).toMatch(/needs the reviewer role/);
  });

  it('404 for unknown notes and versions, 400 for malformed ids', async () => {
    await author.get('/api/v1/notes/999999').expect(404);
    await author.put('/api/v1/notes/999999').send({ title: 'x', markdown: 'y' }).expect(404);
    await reviewer.post('/api/v1/notes/999999/publish').send({}).expect(404);
    await author.get('/api/v1/notes/999999/versions').expect(404);
    const note = await createNote(author, 'Versions 404');
    await author.get(`/api/v1/notes/${note.id}/versions/7`).expect(404);
    const bad = await author.get('/api/v1/notes/abc').expect(400);
    expect(bad.body.error.details[0].field).toBe('id');
    const badN = await author.get(`/api/v1/notes/${note.id}/versions/0`).expect(400);
    expect(badN.body.error.details[0].field).toBe('n');
    await request(t.app).get('/api/v1/public/notes/no-such-note').expect(404);
    await request(t.app).get('/api/v1/public/notes/no-such-note/pdf').expect(404);
    const badSlug = await request(t.app).get('/api/v1/public/notes/Bad_Slug').expect(400);
    expect(badSlug.body.error.details[0].field).toBe('slug');
  });

  it('400 names each invalid field', async () => {
    const fields = async (res: request.Response) => res.body.error.details.map((d: { field: string }) => d.field);
    const create = await author.post('/api/v1/notes').send({ title: '', markdown: 'x'.repeat(200_001), electionKey: 'Not A Key' }).expect(400);
    expect(await fields(create)).toEqual(expect.arrayContaining(['title', 'markdown', 'electionKey']));
    expect(create.body.error.message).toMatch(/title is required/);
    const note = await createNote(author, 'Validation');
    const put = await author.put(`/api/v1/notes/${note.id}`).send({ title: 'ok' }).expect(400);
    expect(await fields(put)).toEqual(['markdown']);
    const preview = await author.post('/api/v1/notes/preview').send({ markdown: 42 }).expect(400);
    expect(await fields(preview)).toEqual(['markdown']);
    await author.post(`/api/v1/notes/${note.id}/submit`).expect(200);
    const ret = await reviewer.post(`/api/v1/notes/${note.id}/return`).send({ comments: '   ' }).expect(400);
    expect(await fields(ret)).toEqual(['comments']);
    expect(ret.body.error.message).toMatch(/comments are required/);
    const list = await viewer.get('/api/v1/notes?state=archived&author=abc').expect(400);
    expect(await fields(list)).toEqual(expect.arrayContaining(['state', 'author']));
    const published = await publishedNote('Validation of corrections');
    const corr = await author.post(`/api/v1/notes/${published.id}/corrections`).send({ markdown: 'fixed' }).expect(400);
    expect(await fields(corr)).toEqual(['notice']);
  });
});

describe('the review workflow', () => {
  let noteId: number;
  let slug: string;

  it('an analyst writes a draft; each save keeps a version', async () => {
    const note = await createNote(author, 'What the 2030 polls missed');
    noteId = note.id;
    slug = note.slug;
    expect(slug).toBe('what-the-2030-polls-missed');
    const first = await author.get(`/api/v1/notes/${noteId}`).expect(200);
    expect(first.body).toMatchObject({ state: 'draft', currentVersion: 1, versionCount: 1, can: { edit: true, submit: true, review: false } });
    expect(first.body.current.html).toContain(STORED_MEAN_ABS);
    expect(first.body.current.dataHashes).toEqual({ [String(auditId)]: dataHash });
    const saved = await author.put(`/api/v1/notes/${noteId}`).send({ title: 'What the 2030 polls missed', markdown: `${noteMarkdown()}\nA second paragraph.\n` }).expect(201);
    expect(saved.body.currentVersion).toBe(2);
    const same = await author.put(`/api/v1/notes/${noteId}`).send({ title: 'What the 2030 polls missed', markdown: `${noteMarkdown()}\nA second paragraph.\n` }).expect(200);
    expect(same.body.versionCount).toBe(2);
    const versions = await author.get(`/api/v1/notes/${noteId}/versions`).expect(200);
    expect(versions.body.items.map((v: { number: number }) => v.number)).toEqual([1, 2]);
    const v1 = await author.get(`/api/v1/notes/${noteId}/versions/1`).expect(200);
    expect(v1.body.markdown).not.toContain('A second paragraph');
    await otherAnalyst.put(`/api/v1/notes/${noteId}`).send({ title: 'Hijack', markdown: 'x' }).expect(403);
    await admin.put(`/api/v1/notes/${noteId}`).send({ title: 'What the 2030 polls missed', markdown: `${noteMarkdown()}\nA second paragraph.\n\nAdmin edit.\n` }).expect(201);
  });

  it('drafts are hidden from viewers', async () => {
    await viewer.get(`/api/v1/notes/${noteId}`).expect(404);
    const list = await viewer.get('/api/v1/notes').expect(200);
    expect(list.body.items.every((n: { state: string }) => n.state !== 'draft')).toBe(true);
    const mine = await author.get(`/api/v1/notes?state=draft&author=${author.user.id}&election=tst-2030-general`).expect(200);
    expect(mine.body.items.map((n: { id: number }) => n.id)).toContain(noteId);
    expect(mine.body.items.every((n: { author: { id: number } }) => n.author.id === author.user.id)).toBe(true);
  });

  it('only the author submits; every reviewer but the author is e-mailed a link', async () => {
    await otherAnalyst.post(`/api/v1/notes/${noteId}/submit`).expect(403);
    const res = await author.post(`/api/v1/notes/${noteId}/submit`).expect(200);
    expect(res.body.state).toBe('in_review');
    for (const r of [reviewer, reviewer2, admin]) {
      const mail = await waitForMail(r.user.email);
      expect(mail.subject).toBe('Review requested: “What the 2030 polls missed”');
      expect(mail.textBody).toContain(`${t.config.publicUrl}/notes/${noteId}`);
      expect(mail.toAddress).toBe(r.user.email);
    }
    await author.post(`/api/v1/notes/${noteId}/submit`).expect(409);
    const edit = await author.put(`/api/v1/notes/${noteId}`).send({ title: 'x', markdown: 'y' }).expect(409);
    expect(edit.body.error.code).toBe('wrong_state');
    await viewer.get(`/api/v1/notes/${noteId}`).expect(200);
  });

  it('a reviewer returns it with comments; the author is e-mailed them', async () => {
    const res = await reviewer.post(`/api/v1/notes/${noteId}/return`).send({ comments: 'Say which undecided treatment the audit used.' }).expect(200);
    expect(res.body.state).toBe('draft');
    expect(res.body.reviews).toEqual([expect.objectContaining({ decision: 'returned', comments: 'Say which undecided treatment the audit used.', versionNumber: 3, reviewer: reviewer.user.name })]);
    const mail = await waitForMail(author.user.email);
    expect(mail.subject).toBe('Returned for changes: “What the 2030 polls missed”');
    expect(mail.textBody).toContain('Say which undecided treatment the audit used.');
    expect(mail.textBody).toContain(`${t.config.publicUrl}/notes/${noteId}`);
    await reviewer.post(`/api/v1/notes/${noteId}/publish`).send({}).expect(409);
  });

  it('an author cannot publish their own note, even as a reviewer', async () => {
    const own = await createNote(reviewer2, 'Reviewer writes too');
    await reviewer2.post(`/api/v1/notes/${own.id}/submit`).expect(200);
    const res = await reviewer2.post(`/api/v1/notes/${own.id}/publish`).send({}).expect(403);
    expect(res.body.error.message).toMatch(/You wrote this note/);
    await reviewer2.post(`/api/v1/notes/${own.id}/return`).send({ comments: 'self' }).expect(403);
    const detail = await reviewer2.get(`/api/v1/notes/${own.id}`).expect(200);
    expect(detail.body.can.review).toBe(false);
    const other = await reviewer.get(`/api/v1/notes/${own.id}`).expect(200);
    expect(other.body.can.review).toBe(true);
  });

  it('another reviewer publishes; the author is e-mailed the public link; the note is then frozen', async () => {
    await author.put(`/api/v1/notes/${noteId}`).send({ title: 'What the 2030 polls missed', markdown: `${noteMarkdown()}\nThe audit used the raw treatment.\n` }).expect(201);
    await author.post(`/api/v1/notes/${noteId}/submit`).expect(200);
    const res = await reviewer2.post(`/api/v1/notes/${noteId}/publish`).send({ comments: 'Clear.' }).expect(200);
    expect(res.body).toMatchObject({ state: 'published', publishedVersion: 4, publicPath: `/public/notes/${slug}` });
    const mail = await waitForMail(author.user.email);
    expect(mail.subject).toBe('Published: “What the 2030 polls missed”');
    expect(mail.textBody).toContain(`${t.config.publicUrl}/public/notes/${slug}`);
    const edit = await author.put(`/api/v1/notes/${noteId}`).send({ title: 'x', markdown: 'changed' }).expect(409);
    expect(edit.body.error.code).toBe('note_published');
    await admin.put(`/api/v1/notes/${noteId}`).send({ title: 'x', markdown: 'changed' }).expect(409);
    await expect(t.ctx.sequelize.query(`UPDATE note_versions SET markdown = 'tampered' WHERE note_id = ${noteId}`)).rejects.toThrow(/append-only/);
  });

  it('the public page is readable signed out and shows only the published note', async () => {
    const res = await request(t.app).get(`/api/v1/public/notes/${slug}`).expect(200);
    expect(res.body).toMatchObject({ slug, title: 'What the 2030 polls missed', version: 4, corrections: [], pdfPath: `/api/v1/public/notes/${slug}/pdf` });
    expect(res.body.html).toContain(STORED_MEAN_ABS);
    expect(res.body.html).toContain('The audit used the raw treatment.');
    expect(res.body.audits).toEqual([expect.objectContaining({ id: auditId, dataHash })]);
    expect(res.body.cautions.join(' ')).toMatch(/sampling error/);
    expect(res.body.cautions.join(' ')).toMatch(/not a forecast/);
    expect(res.body.cautions.join(' ')).toMatch(/few polls/);
    expect(res.body.cautions.join(' ')).toMatch(/share part of their error/);
    const text = JSON.stringify(res.body);
    for (const secret of [author.user.email, reviewer.user.email, 'Say which undecided', 'Clear.']) expect(text).not.toContain(secret);
    expect(Object.keys(res.body).sort()).toEqual(['audits', 'cautions', 'corrected', 'corrections', 'fictional', 'html', 'pdfPath', 'publishedAt', 'slug', 'title', 'updatedAt', 'version']);
    const list = await request(t.app).get('/api/v1/public/notes').expect(200);
    expect(list.body.items.map((n: { slug: string }) => n.slug)).toContain(slug);
    expect(list.body.items.every((n: { slug: string }) => n.slug !== 'reviewer-writes-too')).toBe(true);
    await request(t.app).get('/api/v1/public/notes/reviewer-writes-too').expect(404);
  });

  it('a correction is a new published version with a notice and date; earlier versions stay', async () => {
    await otherAnalyst.post(`/api/v1/notes/${noteId}/corrections`).send({ markdown: 'x', notice: 'y' }).expect(403);
    const corrected = `${noteMarkdown()}\nThe audit used the raw treatment (undecided kept in the base).\n`;
    const res = await author.post(`/api/v1/notes/${noteId}/corrections`).send({ markdown: corrected, notice: 'Said what raw means.' }).expect(201);
    expect(res.body).toMatchObject({ state: 'published', publishedVersion: 5, currentVersion: 5 });
    const page = await request(t.app).get(`/api/v1/public/notes/${slug}`).expect(200);
    expect(page.body.corrections).toEqual([{ version: 5, date: expect.stringMatching(/^\d{4}-\d\d-\d\dT/), notice: 'Said what raw means.' }]);
    expect(page.body.html).toContain('undecided kept in the base');
    const v4 = await author.get(`/api/v1/notes/${noteId}/versions/4`).expect(200);
    expect(v4.body.markdown).not.toContain('undecided kept in the base');
    const list = await author.get(`/api/v1/notes/${noteId}/versions`).expect(200);
    expect(list.body.items.at(-1)).toMatchObject({ number: 5, isCorrection: true, correctionNotice: 'Said what raw means.' });
    await reviewer.post(`/api/v1/notes/${noteId}/corrections`).send({ markdown: corrected, notice: 'Reviewer correction.' }).expect(201);
    const draft = await createNote(author, 'Not yet published');
    await author.post(`/api/v1/notes/${draft.id}/corrections`).send({ markdown: 'x', notice: 'y' }).expect(409);
  });
});

describe('blocks render the stored audit numbers', () => {
  it('keep the published figure after the data change, and the editor marks the audit out of date', async () => {
    const note = await publishedNote('Before the recount');
    const changed = buildResults().map((r) => (r.contest_key === 'tst-2030-north' && r.option_key === 'red' ? { ...r, votes: 41000 } : r));
    await reviewer.post('/api/v1/imports/results').field('reason', 'Recount in North province').attach('file', resultsCsv(changed), 'recount.csv').expect(201);

    const page = await request(t.app).get(`/api/v1/public/notes/${note.slug}`).expect(200);
    expect(page.body.html).toContain(`<strong class="vc-figure">${STORED_MEAN_ABS} pts</strong>`);
    expect(page.body.html).not.toContain('Out of date');

    const preview = await author.post('/api/v1/notes/preview').send({ markdown: block('headline') }).expect(200);
    expect(preview.body.html).toContain(`${STORED_MEAN_ABS} pts`);
    expect(preview.body.html).toContain('Out of date');
    expect(preview.body.audits).toEqual([expect.objectContaining({ id: auditId, outOfDate: true, dataHash })]);
    const detail = await author.get(`/api/v1/notes/${note.id}`).expect(200);
    expect(detail.body.audits[0].outOfDate).toBe(true);

    // A re-run of the audit on the new data shows the moved figure, which the old note does not.
    const rerun = await author.post(`/api/v1/audits/${auditId}/rerun`).expect(201);
    const fresh = await author.post('/api/v1/notes/preview').send({ markdown: block('headline').replace(`audit: ${auditId}`, `audit: ${rerun.body.id}`) }).expect(200);
    expect(fresh.body.html).toContain(`${RECOUNTED_MEAN_ABS} pts`);
    expect(fresh.body.html).not.toContain('Out of date');
  });

  it('an unknown audit or view shows an error box, not a crash', async () => {
    const res = await author.post('/api/v1/notes/preview').send({ markdown: '```veracast\naudit: 424242\nview: headline\n```\n\n```veracast\naudit: 1\nview: pie\n```\n' }).expect(200);
    expect(res.body.problems).toEqual(['audit #424242 does not exist', expect.stringMatching(/^unknown view "pie"/)]);
    expect(res.body.html.match(/class="vc-block-error"/g)).toHaveLength(2);
  });
});

describe('XSS payloads are neutralised', () => {
  const payloads = [
    '<script>alert("s1")</script>',
    '<img src=x onerror=alert("s2")>',
    '[click](javascript:alert("s3"))',
    '[click2](JaVaScRiPt:alert("s4"))',
    '<a href="javascript:alert(\'s5\')">raw link</a>',
    '![pic](javascript:alert("s6"))',
    '<svg onload=alert("s7")></svg>',
    '$\\href{javascript:alert("s8")}{math link}$',
    '[data](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)',
  ].join('\n\n');

  /** Walks every element of the HTML: no script-capable element, no on* attribute, no javascript:/data: address. */
  const assertSafeHtml = (html: string) => {
    const elements: HtmlElement[] = [];
    const walk = (el: HtmlElement) => el.children.forEach((c) => typeof c !== 'string' && (elements.push(c), walk(c)));
    walk(parseHtml(html));
    expect(elements.length).toBeGreaterThan(5);
    for (const el of elements) {
      expect(['script', 'img', 'iframe', 'object', 'embed', 'style', 'link', 'meta', 'foreignobject']).not.toContain(el.tag);
      for (const [name, value] of Object.entries(el.attrs)) {
        expect(name).not.toMatch(/^on/);
        expect(value).not.toMatch(/^\s*(javascript|data|vbscript):/i);
      }
    }
    expect(html).not.toMatch(/<script/i);
  };

  it('in the preview, on the public page and in the PDF', async () => {
    const preview = await author.post('/api/v1/notes/preview').send({ markdown: payloads }).expect(200);
    assertSafeHtml(preview.body.html);
    // The text stays visible as text, so readers can see what was written.
    expect(preview.body.html).toContain('&lt;script&gt;');
    const note = await publishedNote('Hostile markdown', `# Hostile\n\n${payloads}\n`);
    const page = await request(t.app).get(`/api/v1/public/notes/${note.slug}`).expect(200);
    assertSafeHtml(page.body.html);
    const pdf = await request(t.app).get(`/api/v1/public/notes/${note.slug}/pdf`).buffer(true).parse(binary).expect(200);
    const raw = (pdf.body as Buffer).toString('latin1');
    expect(raw.startsWith('%PDF-')).toBe(true);
    expect(raw).not.toMatch(/\/JavaScript|\/JS\s|\/Launch|\/OpenAction/);
    expect(raw).not.toMatch(/javascript:/i);
  });
});

function binary(res: request.Response, cb: (err: Error | null, body: Buffer) => void) {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => cb(null, Buffer.concat(chunks)));
}

describe('the PDF of a published note', () => {
  it('carries the title, a figure from a block, the data hash and date, with Work Sans embedded', async () => {
    const note = await publishedNote('Printable audit note');
    const res = await request(t.app).get(`/api/v1/public/notes/${note.slug}/pdf`).buffer(true).parse(binary).expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/printable-audit-note-v1\.pdf/);
    const file = path.join(os.tmpdir(), `note-${Date.now()}.pdf`);
    fs.writeFileSync(file, res.body as Buffer);
    try {
      const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
      expect(text).toContain('Printable audit note');
      expect(text).toContain(`${STORED_MEAN_ABS} pts`);
      expect(text).toContain(dataHash);
      const page = await request(t.app).get(`/api/v1/public/notes/${note.slug}`).expect(200);
      expect(text).toContain(`Published ${String(page.body.publishedAt).slice(0, 10)}`);
      const fonts = execFileSync('pdffonts', [file], { encoding: 'utf8' });
      expect(fonts).toMatch(/WorkSans-Regular\s+CID TrueType\s+Identity-H\s+yes/);
    } finally {
      fs.rmSync(file, { force: true });
    }
  });
});
