import { describe, expect, it } from 'vitest';
import type { AuditSnapshot } from './audit-data';
import { parseBlockSpec } from './blocks';
import { niceTicks } from './chart';
import { findElement, parseHtml, textOf } from './html-tree';
import { citedAuditIds, renderWithAudits } from './render';
import { sanitizeNoteHtml } from './sanitize';

const snapshot = (over: Partial<AuditSnapshot> = {}): AuditSnapshot => ({
  id: 7, name: 'Unit audit', settings: { name: 'Unit audit', electionKeys: ['e-1'], windowDays: 21, finalOnly: true, undecided: 'raw', minPolls: 5, designEffect: 1 },
  dataHash: 'f'.repeat(64), coreVersion: 'core-test', createdAt: '2026-12-01T00:00:00.000Z',
  headline: { pollsUsed: 4, pollsTotal: 5, meanAbsMarginError: 2.346, meanSignedError: -1.5, meanSignedErrorInterval: [-3.25, 0.25], signedDirection: 'polls understated RED against BLUE', marginCoverage: 0.75, shareCoverage: 1, winnerCalledRate: 0.5, calls: 4, noCalls: 0, notComputable: 1 },
  scorecards: null, sharedError: {}, elections: [{ key: 'e-1', name: 'E', date: '2030-01-01', fictional: false }], polls: [], currentHash: null, ...over,
});

describe('live block syntax', () => {
  it('reads key: value lines and names every problem', () => {
    expect(parseBlockSpec('audit: 12\nview: polls\nlimit: 5\n# a comment')).toEqual({ ok: true, spec: { view: 'polls', audit: 12, election: null, metric: null, limit: 5, by: null } });
    expect(parseBlockSpec('view: methods')).toMatchObject({ ok: true, spec: { view: 'methods', audit: null } });
    expect(parseBlockSpec('audit: 1')).toEqual({ ok: false, error: expect.stringMatching(/"view" is missing/) });
    expect(parseBlockSpec('view: headline')).toEqual({ ok: false, error: expect.stringMatching(/"audit" is missing/) });
    expect(parseBlockSpec('audit: x\nview: headline')).toEqual({ ok: false, error: 'audit "x" is not an audit number' });
    expect(parseBlockSpec('audit: 1\nview: scorecard\nlimit: 3')).toEqual({ ok: false, error: '"limit" applies to the polls view only' });
    expect(parseBlockSpec('audit: 1\nview: polls\nlimit: 501')).toMatchObject({ ok: false });
    expect(parseBlockSpec('audit: 1\nview: headline\ncolour: red')).toEqual({ ok: false, error: expect.stringMatching(/^unknown key "colour"/) });
  });

  it('lists cited audits once, in order of first mention', () => {
    const md = '```veracast\naudit: 3\nview: headline\n```\n\n```veracast\naudit: 1\nview: scorecard\n```\n\n```veracast\naudit: 3\nview: polls\n```\n';
    expect(citedAuditIds(md)).toEqual([3, 1]);
  });
});

describe('rendering', () => {
  it('renders a headline from the stored figure, never from anything else', () => {
    const md = '```veracast\naudit: 7\nview: headline\n```\n\n```veracast\naudit: 7\nview: headline\nmetric: marginCoverage\n```';
    const { html, problems } = renderWithAudits(md, new Map([[7, snapshot()]]), [7], false);
    expect(problems).toEqual([]);
    // The stored 2.346 shown with two decimals [practice: figures in points to two decimals].
    expect(html).toContain('<strong class="vc-figure">2.35 pts</strong>');
    expect(html).toContain('<strong class="vc-figure">75%</strong>');
    expect(html).toContain('f'.repeat(64));
  });

  it('marks an out-of-date audit only when asked (the editor preview)', () => {
    const stale = snapshot({ currentHash: 'e'.repeat(64) });
    const md = '```veracast\naudit: 7\nview: headline\n```';
    expect(renderWithAudits(md, new Map([[7, stale]]), [7], true).html).toContain('Out of date');
    expect(renderWithAudits(md, new Map([[7, stale]]), [7], false).html).not.toContain('Out of date');
  });

  it('turns a bad block into a visible error box', () => {
    const { html, problems } = renderWithAudits('```veracast\naudit: 8\nview: headline\n```\n\n```veracast\naudit: 7\nview: shared-error\nelection: e-9\n```', new Map([[7, snapshot()]]), [8, 7], false);
    expect(problems).toEqual(['audit #8 does not exist', 'audit #7 does not cover election "e-9"; it covers e-1']);
    expect(html.match(/vc-block-error/g)).toHaveLength(2);
  });

  it('renders $…$ and $$…$$ with KaTeX but leaves prices alone', () => {
    const { html } = renderWithAudits('Cost $5 and $10; error $e = p_A - p_B$.\n\n$$\n\\frac{1}{n}\n$$', new Map(), [], false);
    const tree = parseHtml(html);
    const annotations: string[] = [];
    const collect = (el: ReturnType<typeof parseHtml>) => el.children.forEach((c) => { if (typeof c !== 'string') { if (c.tag === 'annotation') annotations.push(textOf(c)); collect(c); } });
    collect(tree);
    expect(annotations).toEqual(['e = p_A - p_B', '\\frac{1}{n}']);
    expect(html).toContain('Cost $5 and $10;');
    expect(findElement(tree, (e) => e.attrs.class === 'vc-math-display')).not.toBeNull();
  });
});

describe('the sanitiser', () => {
  it('strips script, handlers, dangerous addresses and images from raw HTML', () => {
    const out = sanitizeNoteHtml(
      '<p onclick="x()">a<script>alert(1)</script><img src="x" onerror="y()"><a href="javascript:alert(1)">j</a><a href="https://example.org" onmouseover="z()">ok</a>' +
      '<a href="//evil.example/x">pr</a><iframe src="https://example.org"></iframe><style>body{}</style></p><svg onload="a()"><circle cx="1" cy="1" r="1"></circle></svg>' +
      '<span style="position:fixed;top:0;background:url(javascript:x)">s</span>',
    );
    expect(out).not.toMatch(/script|onerror|onclick|onload|onmouseover|javascript|iframe|<img|<style|evil\.example|position|background/);
    expect(out).toContain('<a href="https://example.org">ok</a>');
    expect(out).toContain('<circle cx="1" cy="1" r="1"></circle>');
    expect(out).toContain('<span style="top:0">s</span>');
  });
});

describe('chart ticks', () => {
  it('uses steps of 1, 2 or 5 times a power of ten', () => {
    expect(niceTicks(-2.2, 3.1)).toEqual([-2, -1, 0, 1, 2, 3]);
    expect(niceTicks(0, 47)).toEqual([0, 10, 20, 30, 40]);
  });
});
