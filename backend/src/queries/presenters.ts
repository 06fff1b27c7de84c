import type { ContestDto, ElectionDto, PollDto } from '@veracast/shared-types';
import { certifiedShares, disclosureOf, orientationOf, type ContestRow, type ElectionRow, type PollRow } from './archive';

export function presentElection(e: ElectionRow, contests: readonly ContestRow[], pollCounts: Map<number, number>): ElectionDto {
  const own = contests.filter((c) => c.electionId === e.id);
  const o = orientationOf(e, contests);
  return {
    key: e.key, name: e.name, date: e.date, jurisdiction: e.jurisdiction, fictional: e.fictional, blocA: o.blocA, blocB: o.blocB,
    orientationSource: o.source, blackoutStart: e.blackoutStart, blackoutEnd: e.blackoutEnd, contestCount: own.length,
    certifiedCount: own.filter((c) => c.status === 'certified').length, pollCount: own.reduce((a, c) => a + (pollCounts.get(c.id) ?? 0), 0),
  };
}

export function presentContest(c: ContestRow, e: ElectionRow, allContests: readonly ContestRow[], pollCount: number): ContestDto {
  const shares = certifiedShares(c.options);
  const validVotes = c.options.reduce((a, o) => a + (o.votes ?? 0), 0) || null;
  const o = orientationOf(e, allContests);
  const hasBlocs = o.blocA && o.blocB && c.options.some((x) => x.bloc === o.blocA) && c.options.some((x) => x.bloc === o.blocB);
  const pick = (bloc: string) => [...c.options].filter((x) => x.bloc === bloc).sort((a, b) => (b.votes ?? 0) - (a.votes ?? 0))[0]?.key ?? null;
  const ranked = [...c.options].sort((a, b) => (b.votes ?? 0) - (a.votes ?? 0) || (a.key < b.key ? -1 : 1));
  const turnoutBase = c.electorate && validVotes ? (validVotes + (c.rejectedBallots ?? 0)) / c.electorate : null;
  return {
    key: c.key, name: c.name, kind: c.kind, electionKey: e.key, electionName: e.name, electionDate: e.date, fictional: e.fictional,
    status: c.status, certifiedOn: c.certifiedOn, certifyingBody: c.certifyingBody, sourceUrl: c.sourceUrl, validVotes,
    rejectedBallots: c.rejectedBallots, electorate: c.electorate, turnout: turnoutBase,
    options: c.options.map((x) => ({ key: x.key, name: x.name, bloc: x.bloc, votes: x.votes, share: shares ? (shares[x.key] ?? null) : null })),
    pollCount, refA: hasBlocs ? pick(o.blocA!) : validVotes ? (ranked[0]?.key ?? null) : null, refB: hasBlocs ? pick(o.blocB!) : validVotes ? (ranked[1]?.key ?? null) : null,
  };
}

export function presentPoll(p: PollRow, contest: ContestRow, election: ElectionRow): PollDto {
  return {
    key: p.key, pollsterId: p.pollsterId, pollster: p.pollster, sponsor: p.sponsor, sponsorType: p.sponsorType, contestKey: contest.key, electionKey: election.key,
    fieldworkStart: p.fieldworkStart, fieldworkEnd: p.fieldworkEnd, publishedOn: p.publishedOn, sampleSize: p.sampleSize, population: p.population, mode: p.mode,
    moe: p.moe, studyKey: p.studyKey, isHeadline: p.isHeadline, tracking: p.tracking, sourceUrl: p.sourceUrl, tablesUrl: p.tablesUrl, questionWording: p.questionWording, weightingStatement: p.weightingStatement, shares: p.shares, disclosure: disclosureOf(p),
    fictional: election.fictional,
  };
}
