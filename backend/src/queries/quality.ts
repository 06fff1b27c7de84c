import type { QualityIssueDto } from '@veracast/shared-types';
import type { ContestRow, ElectionRow, PollRow } from './archive';
import { groupBy } from '../analysis/group-by';

const overlap = (a: PollRow, b: PollRow) => a.fieldworkStart <= b.fieldworkEnd && b.fieldworkStart <= a.fieldworkEnd;
const sharesEqual = (a: PollRow, b: PollRow, tol = 0.5) => {
  const keys = new Set([...Object.keys(a.shares), ...Object.keys(b.shares)]);
  for (const k of keys) if (Math.abs((a.shares[k] ?? 0) - (b.shares[k] ?? 0)) > tol) return false;
  return true;
};

/**
 * Checks after import (issue: data quality): possible duplicates, overlapping tracking waves,
 * study versions without a headline, shares far from 100, provisional results, contests without a
 * result, polls published inside a blackout period. Pure: rows in, issues out.
 */
export function qualityIssues(elections: readonly ElectionRow[], contests: readonly ContestRow[], polls: readonly PollRow[]): QualityIssueDto[] {
  const issues: QualityIssueDto[] = [];
  const contestById = new Map(contests.map((c) => [c.id, c]));
  const electionById = new Map(elections.map((e) => [e.id, e]));
  const ek = (c: ContestRow | undefined) => (c ? (electionById.get(c.electionId)?.key ?? null) : null);

  for (const c of contests) {
    const total = c.options.reduce((a, o) => a + (o.votes ?? 0), 0);
    if (!c.status || total === 0) {
      issues.push({ code: 'contest_without_result', severity: 'warning', electionKey: ek(c), contestKey: c.key, pollKeys: [], message: `Contest ${c.name} has no result yet; its polls cannot be scored.` });
    } else if (c.status === 'provisional') {
      issues.push({ code: 'result_provisional', severity: 'info', electionKey: ek(c), contestKey: c.key, pollKeys: [], message: `The result of ${c.name} is still provisional; audits of it may change when it is certified.` });
    }
  }

  const byFirmContest = groupBy(polls, (p) => `${p.pollsterId}\u0000${p.contestId}`);
  for (const p of polls) {
    const sum = Object.values(p.shares).reduce((a, b) => a + b, 0);
    if (sum < 95 || sum > 100.5) {
      const c = contestById.get(p.contestId);
      issues.push({ code: 'shares_off_100', severity: 'warning', electionKey: ek(c), contestKey: c?.key ?? null, pollKeys: [p.key], message: `Shares of poll ${p.key} sum to ${sum.toFixed(1)}, not near 100 (add undecided or other if the source reports them).` });
    }
    const c = contestById.get(p.contestId);
    const e = c ? electionById.get(c.electionId) : undefined;
    if (e?.blackoutStart && p.publishedOn >= e.blackoutStart && p.publishedOn <= (e.blackoutEnd ?? e.date)) {
      issues.push({ code: 'published_in_blackout', severity: 'warning', electionKey: e.key, contestKey: c!.key, pollKeys: [p.key], message: `Poll ${p.key} was published on ${p.publishedOn}, inside the publication blackout (${e.blackoutStart} to ${e.blackoutEnd ?? e.date}).` });
    }
  }
  for (const group of byFirmContest.values()) {
    const c = contestById.get(group[0]!.contestId);
    for (let i = 0; i < group.length; i++) {
      for (let j = i + 1; j < group.length; j++) {
        const a = group[i]!;
        const b = group[j]!;
        if (!overlap(a, b)) continue;
        const sameStudy = a.studyKey && a.studyKey === b.studyKey;
        if (sameStudy) continue;
        if (a.tracking && b.tracking) {
          issues.push({ code: 'overlapping_tracking', severity: 'info', electionKey: ek(c), contestKey: c?.key ?? null, pollKeys: [a.key, b.key], message: `Tracking waves ${a.key} and ${b.key} of ${a.pollster} overlap in fieldwork; they share respondents and are not independent.` });
        } else if (sharesEqual(a, b)) {
          issues.push({ code: 'possible_duplicate', severity: 'warning', electionKey: ek(c), contestKey: c?.key ?? null, pollKeys: [a.key, b.key], message: `Polls ${a.key} and ${b.key} by ${a.pollster} have overlapping fieldwork and shares equal within rounding: possibly one poll entered twice.` });
        }
      }
    }
  }
  const studies = groupBy(polls.filter((p) => p.studyKey), (p) => `${p.pollsterId}\u0000${p.studyKey}`);
  for (const versions of studies.values()) {
    if (versions.length > 1 && versions.filter((v) => v.isHeadline).length !== 1) {
      const c = contestById.get(versions[0]!.contestId);
      issues.push({ code: 'study_without_headline', severity: 'warning', electionKey: ek(c), contestKey: c?.key ?? null, pollKeys: versions.map((v) => v.key), message: `Study ${versions[0]!.studyKey} of ${versions[0]!.pollster} has ${versions.length} versions (e.g. LV and RV) but ${versions.filter((v) => v.isHeadline).length} marked as headline; mark exactly one so audits count the study once.` });
    }
  }
  return issues;
}
