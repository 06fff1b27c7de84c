/**
 * Seeded generation of the demo scenario: certified results and the poll archive.
 *
 * The poll model, per poll of firm f in contest c of election e, at fieldwork midpoint t days out:
 *
 *   1. opinion        q(t) = certified shares V + movement_e · g(t),  g(t) = min(1, t / 35)
 *                     (opinion drifts to the result over the last five weeks: polls lag it);
 *   2. published base p = q(t) · (1 − u) with undecided u, falling as polling day nears;
 *   3. shifts         p += shared_e · s_f / s̄  +  province_c  +  house_f,e
 *                     (shared error of the election, scaled by the firm's susceptibility s_f
 *                     normalised to a poll-weighted mean of 1; an extra shared error per province
 *                     contest; the firm's house lean for that election);
 *   4. sampling       a multinomial draw of n / deff respondents (normal approximation, drawn as
 *                     conditional binomials so the covariances are right);
 *   5. publication    small options folded into `other` by some firms, then rounded to whole or
 *                     tenth points.
 *
 * Margin error therefore decomposes into shared + house + sampling (+ lag early in the campaign),
 * which is what the shared-error analysis looks for.
 */
import { apportion, createRng, type Rng } from './random';
import { CsvChunks, csvLine, dayNumber, isoDate, slugify } from './text';
import {
  DEMO_COUNTRY,
  DEMO_ELECTIONS,
  DEMO_PARTIES,
  DEMO_POLLSTERS,
  DEMO_PROVINCES,
  DEMO_SHARED_MISS,
  GIVEN_NAMES,
  SURNAME_HEADS,
  SURNAME_TAILS,
  type ContestKind,
  type DemoElectionSpec,
  type DemoParty,
  type DemoPollster,
  type DemoProvince,
  type PollPopulation,
  type SponsorType,
} from './scenario';

/** Required columns (SPEC §3) followed by the optional extra `contest_kind`. */
export const RESULTS_COLUMNS = [
  'election_key', 'election_date', 'election_name', 'jurisdiction', 'contest_key', 'contest_name',
  'option_key', 'option_name', 'bloc', 'votes', 'status', 'certified_on', 'source_url', 'contest_kind',
] as const;

/** Required columns (SPEC §3) followed by the optional extras `sponsor_type` and `source_url`. */
export const POLLS_COLUMNS = [
  'poll_key', 'pollster', 'sponsor', 'contest_key', 'fieldwork_start', 'fieldwork_end', 'published_on',
  'sample_size', 'population', 'mode', 'moe', 'option_key', 'share', 'sponsor_type', 'source_url',
] as const;

export interface DemoOption {
  readonly key: string;
  readonly name: string;
  readonly bloc: string;
  readonly votes: number;
}

export interface DemoContest {
  readonly key: string;
  readonly name: string;
  readonly kind: ContestKind;
  readonly jurisdiction: string;
  readonly provinceKey?: string;
  readonly options: readonly DemoOption[];
  readonly status: 'certified' | 'provisional';
  readonly certifiedOn: string;
  readonly sourceUrl: string;
}

export interface DemoElection {
  readonly key: string;
  readonly spec: DemoElectionSpec;
  readonly day: number;
  readonly contests: readonly DemoContest[];
}

export interface DemoPoll {
  readonly key: string;
  readonly pollster: string;
  readonly firm: DemoPollster;
  readonly sponsor: string;
  readonly sponsorType: SponsorType;
  readonly contestKey: string;
  readonly startDay: number;
  readonly endDay: number;
  readonly publishedDay: number;
  readonly sampleSize: number;
  readonly population: PollPopulation;
  readonly moe: string;
  readonly shares: readonly { readonly optionKey: string; readonly share: string }[];
}

export interface DemoSummary {
  readonly country: string;
  readonly fictional: true;
  readonly seed: number;
  readonly elections: number;
  readonly contests: number;
  readonly referendumContests: number;
  readonly provisionalContests: number;
  readonly resultRows: number;
  readonly polls: number;
  readonly pollRows: number;
  readonly pollsters: number;
  readonly pollsterSpellings: number;
  readonly pollsByElection: Readonly<Record<string, number>>;
  readonly sharedMiss: typeof DEMO_SHARED_MISS;
}

export interface DemoData {
  readonly elections: readonly DemoElection[];
  readonly polls: readonly DemoPoll[];
}

const SLUG = DEMO_COUNTRY.slug;
const RESULTS_HOST = 'https://results.example.org';
const POLLS_HOST = 'https://polls.example.org';

export function electionKeyOf(spec: DemoElectionSpec): string {
  return `${SLUG}-${spec.year}-${spec.kind}`;
}

// ---------------------------------------------------------------------------------------------
// Results

function normalise(values: readonly number[]): number[] {
  const total = values.reduce((a, b) => a + b, 0);
  return values.map((v) => v / total);
}

function candidateName(rng: Rng): { full: string; surname: string } {
  const surname = rng.pick(SURNAME_HEADS) + rng.pick(SURNAME_TAILS);
  return { full: `${rng.pick(GIVEN_NAMES)} ${surname}`, surname };
}

function partyByKey(key: string): DemoParty {
  const party = DEMO_PARTIES.find((p) => p.key === key);
  if (!party) throw new Error(`unknown party ${key}`);
  return party;
}

function runsGovernor(party: DemoParty, province: DemoProvince, year: number): boolean {
  if (party.founded > year) return false;
  if (party.standsAsideIn?.includes(province.key)) return false;
  return party.governor === 'all' || party.governor.includes(province.key);
}

function buildGeneral(spec: DemoElectionSpec, key: string, seed: number): DemoContest[] {
  const rng = createRng(`${seed}/results/${key}`);
  const list = spec.nationalList ?? {};
  const listParties = DEMO_PARTIES.filter((p) => p.nationalList && list[p.key] !== undefined);
  const target = normalise(listParties.map((p) => Math.max(1, (list[p.key] ?? 0) + rng.normal(0, 0.6))));
  const years = spec.year - 2014;

  // Provincial list shares: national target + regional offsets + noise, re-balanced once so the
  // national total lands on the target.
  const valid = DEMO_PROVINCES.map((prov) => {
    const registered = Math.round(prov.registered2014 * 1.006 ** years * (1 + rng.normal(0, 0.01)));
    const turnout = Math.min(0.9, Math.max(0.4, spec.turnout + prov.turnoutShift + rng.normal(0, 0.015)));
    return Math.round(registered * turnout * 0.985);
  });
  let shares = DEMO_PROVINCES.map((prov) =>
    normalise(listParties.map((p, i) =>
      Math.max(0.3, 100 * (target[i] ?? 0) + (prov.listOffsets[p.offsetKey] ?? 0) + rng.normal(0, 1)))));
  const totalValid = valid.reduce((a, b) => a + b, 0);
  const national = listParties.map((_, i) =>
    shares.reduce((acc, s, p) => acc + (s[i] ?? 0) * (valid[p] ?? 0), 0) / totalValid);
  shares = shares.map((s) =>
    normalise(s.map((x, i) => Math.max(0.003, x + (target[i] ?? 0) - (national[i] ?? 0)))));
  const listVotes = shares.map((s, p) => apportion(valid[p] ?? 0, s));

  const electionDay = dayNumber(spec.date);
  const nationalCertified = electionDay + rng.int(12, 20);
  const contests: DemoContest[] = [];
  const yearSlug = `${spec.year}-${spec.kind}`;

  contests.push({
    key: `${key}-national`,
    name: 'National list vote',
    kind: 'national',
    jurisdiction: DEMO_COUNTRY.shortName,
    options: listParties.map((p, i) => ({
      key: p.key,
      name: p.name,
      bloc: p.bloc,
      votes: listVotes.reduce((acc, v) => acc + (v[i] ?? 0), 0),
    })),
    status: 'certified',
    certifiedOn: isoDate(nationalCertified),
    sourceUrl: `${RESULTS_HOST}/${SLUG}/${yearSlug}/national-list`,
  });

  DEMO_PROVINCES.forEach((prov, p) => {
    const provShares = shares[p] ?? [];
    const standing = DEMO_PARTIES.filter((party) => runsGovernor(party, prov, spec.year));
    let gov = standing.map((party) => {
      const source = party.inheritsFrom ? partyByKey(party.inheritsFrom) : party;
      const i = listParties.indexOf(source);
      const base = i >= 0 ? 100 * (provShares[i] ?? 0) : 0;
      return party.inheritsFrom ? base + 3 : base;
    });
    // Small parties are squeezed in a single-winner race; the top two pick up the votes.
    const order = gov.map((s, i) => ({ s, i })).sort((a, b) => b.s - a.s || a.i - b.i);
    const topTwo = order.slice(0, 2).map((o) => o.i);
    let freed = 0;
    gov = gov.map((s, i) => {
      if (topTwo.includes(i) || s >= 12) return s;
      freed += s * 0.25;
      return s * 0.75;
    });
    const topSum = topTwo.reduce((acc, i) => acc + (gov[i] ?? 0), 0);
    gov = gov.map((s, i) => (topTwo.includes(i) ? s + (freed * s) / topSum : s));
    gov = gov.map((s) => Math.max(0.8, s + rng.normal(0, 2)));

    const options: { key: string; name: string; bloc: string; weight: number }[] = standing.map((party, i) => ({
      key: party.key,
      name: `${candidateName(rng).full} (${party.name})`,
      bloc: party.bloc,
      weight: gov[i] ?? 0,
    }));
    if (rng.chance(0.35)) {
      const independent = candidateName(rng);
      const indShare = rng.uniform(3, 14);
      const scale = (100 - indShare) / options.reduce((acc, o) => acc + o.weight, 0);
      for (const o of options) o.weight *= scale;
      options.push({
        key: `ind-${slugify(independent.surname)}`,
        name: `${independent.full} (independent)`,
        bloc: '',
        weight: indShare,
      });
    }
    const validGov = Math.round((valid[p] ?? 0) * rng.uniform(0.975, 0.995));
    const votes = apportion(validGov, options.map((o) => o.weight));
    const provisional = spec.provisionalProvinces?.includes(prov.key) ?? false;
    const certified = Math.max(electionDay + 8, nationalCertified + rng.int(-3, 5));
    contests.push({
      key: `${key}-${prov.key}`,
      name: `Governor of ${prov.name}`,
      kind: 'province',
      jurisdiction: prov.name,
      provinceKey: prov.key,
      options: options.map((o, i) => ({ key: o.key, name: o.name, bloc: o.bloc, votes: votes[i] ?? 0 })),
      status: provisional ? 'provisional' : 'certified',
      certifiedOn: provisional ? '' : isoDate(certified),
      sourceUrl: provisional
        ? `${RESULTS_HOST}/${SLUG}/${yearSlug}/governor/${prov.key}/provisional-count`
        : `${RESULTS_HOST}/${SLUG}/${yearSlug}/governor/${prov.key}`,
    });
  });

  if (spec.referendum) contests.push(buildReferendum(spec, key, rng, electionDay));
  return contests;
}

function buildReferendum(spec: DemoElectionSpec, key: string, rng: Rng, electionDay: number): DemoContest {
  const ref = spec.referendum;
  if (!ref) throw new Error(`${key} has no referendum`);
  const years = spec.year - 2014;
  const registered = DEMO_PROVINCES.reduce((acc, prov) => acc + prov.registered2014 * 1.006 ** years, 0);
  const validVotes = Math.round(registered * (ref.turnout + rng.normal(0, 0.01)) * 0.99);
  const yes = Math.min(95, Math.max(5, ref.yesShare + rng.normal(0, 0.5)));
  const votes = apportion(validVotes, [yes, 100 - yes]);
  return {
    key: `${key}-${ref.slug}`,
    name: ref.question,
    kind: 'referendum',
    jurisdiction: DEMO_COUNTRY.shortName,
    options: [
      { key: 'yes', name: 'Yes', bloc: 'YES', votes: votes[0] ?? 0 },
      { key: 'no', name: 'No', bloc: 'NO', votes: votes[1] ?? 0 },
    ],
    status: 'certified',
    certifiedOn: isoDate(electionDay + rng.int(9, 16)),
    sourceUrl: `${RESULTS_HOST}/${SLUG}/${spec.year}-${spec.kind}/${ref.slug}`,
  };
}

export function buildElections(seed: number): DemoElection[] {
  return DEMO_ELECTIONS.map((spec) => {
    const key = electionKeyOf(spec);
    const day = dayNumber(spec.date);
    const contests =
      spec.kind === 'general'
        ? buildGeneral(spec, key, seed)
        : [buildReferendum(spec, key, createRng(`${seed}/results/${key}`), day)];
    return { key, spec, day, contests };
  });
}

// ---------------------------------------------------------------------------------------------
// Polls

const FIELD_DAYS: Readonly<Record<DemoPollster['mode'], readonly [number, number]>> = {
  phone: [3, 5], ivr: [1, 2], online: [2, 4], text: [1, 3], mixed: [3, 6], face: [7, 12], mail: [10, 16],
};

interface Slot {
  readonly firm: DemoPollster;
  readonly contest: DemoContest;
  readonly daysOut: number;
}

/** Fieldwork-end days out for k polls of a firm: spread over its window, crowded late. */
function schedule(firm: DemoPollster, k: number, rng: Rng): number[] {
  const { earliest, latest, shape } = firm.timing;
  const days: number[] = [];
  for (let j = 0; j < k; j += 1) {
    const u = Math.min(1, Math.max(0, (j + 0.5 + rng.normal(0, 0.2)) / k));
    days.push(Math.round(latest + (earliest - latest) * u ** shape));
  }
  return days;
}

function oneDay(firm: DemoPollster, rng: Rng): number {
  const { earliest, latest, shape } = firm.timing;
  return Math.round(latest + (earliest - latest) * rng.next() ** shape);
}

/**
 * Adds share points to the options of the blocs listed in `shift` and takes the total pro rata
 * from the other named options (never from undecided, which is the last entry). Returns new
 * probabilities, clamped away from zero and renormalised.
 */
function applyShift(
  probs: readonly number[],
  blocs: readonly string[],
  shift: Readonly<Record<string, number>>,
  factor: number,
): number[] {
  const out = probs.slice();
  const named = probs.length - 1;
  const touched = new Array<boolean>(named).fill(false);
  let added = 0;
  for (let i = 0; i < named; i += 1) {
    const bloc = blocs[i] ?? '';
    const points = bloc === '' ? undefined : shift[bloc];
    if (points === undefined || points === 0) continue;
    out[i] = (out[i] ?? 0) + (points * factor) / 100;
    added += (points * factor) / 100;
    touched[i] = true;
  }
  if (added !== 0) {
    let rest = 0;
    for (let i = 0; i < named; i += 1) if (!touched[i]) rest += probs[i] ?? 0;
    if (rest > 0) {
      for (let i = 0; i < named; i += 1) {
        if (!touched[i]) out[i] = (out[i] ?? 0) - (added * (probs[i] ?? 0)) / rest;
      }
    }
  }
  return normalise(out.map((p) => Math.max(0.001, p)));
}

/** Multinomial proportions from n respondents, normal approximation to conditional binomials. */
function sampleShares(probs: readonly number[], n: number, rng: Rng): number[] {
  const out: number[] = [];
  let remainingN = n;
  let remainingP = 1;
  for (let i = 0; i < probs.length - 1; i += 1) {
    const p = Math.min(1, Math.max(0, (probs[i] ?? 0) / remainingP));
    const mean = remainingN * p;
    const sd = Math.sqrt(remainingN * p * (1 - p));
    const x = Math.min(remainingN, Math.max(0, rng.normal(mean, sd)));
    out.push(x / n);
    remainingN -= x;
    remainingP -= probs[i] ?? 0;
  }
  out.push(remainingN / n);
  return out;
}

/**
 * Rounds shares (points) to whole or tenth points. Firms that force 100 use largest remainders;
 * the others round each share and only correct totals outside 99–100.
 */
function roundShares(points: readonly number[], decimals: 0 | 1, forceHundred: boolean): number[] {
  const scale = decimals === 1 ? 10 : 1;
  const units = points.map((p) => p * scale);
  let rounded = units.map((u) => Math.round(u));
  const sum = rounded.reduce((a, b) => a + b, 0);
  const low = 99 * scale;
  const high = 100 * scale;
  if (forceHundred || sum > high || sum < low) rounded = apportion(high, units);
  return rounded;
}

function formatShare(units: number, decimals: 0 | 1): string {
  return decimals === 1 ? (units / 10).toFixed(1) : String(units);
}

interface ElectionPollContext {
  readonly election: DemoElection;
  readonly house: ReadonlyMap<string, { lean: number; leanYes: number }>;
  readonly contestBias: ReadonlyMap<string, number>;
  readonly sharedScale: ReadonlyMap<string, number>;
}

function makePoll(slot: Slot, ctx: ElectionPollContext, rng: Rng): Omit<DemoPoll, 'key'> {
  const { firm, contest } = slot;
  const { election } = ctx;
  const spec = election.spec;
  const [minLen, maxLen] = FIELD_DAYS[firm.mode];
  const daysOut = Math.max(2, slot.daysOut);
  const length = rng.int(minLen, maxLen);
  const endDay = election.day - daysOut;
  const startDay = endDay - (length - 1);
  const publishedDay = endDay + Math.min(rng.int(1, 4), daysOut - 1);
  const t = election.day - (startDay + endDay) / 2;

  const province = contest.kind === 'province';
  const sizeMean = firm.sampleSize.mean * (province ? 0.55 : 1);
  const rawN = Math.max(150, rng.normal(sizeMean, firm.sampleSize.sd * (province ? 0.55 : 1)));
  const sampleSize = Math.max(firm.sampleSize.roundTo, Math.round(rawN / firm.sampleSize.roundTo) * firm.sampleSize.roundTo);
  const population: PollPopulation =
    firm.lvWithinDays !== undefined && daysOut <= firm.lvWithinDays ? 'lv' : firm.population;
  const srsMoe = 1.96 * Math.sqrt(0.25 / sampleSize) * 100;
  const moe =
    firm.moe === 'none' ? '' : (firm.moe === 'deff' ? srsMoe * Math.sqrt(firm.designEffect) : srsMoe).toFixed(1);

  // 1. opinion at the fieldwork midpoint
  const votesTotal = contest.options.reduce((acc, o) => acc + o.votes, 0);
  const blocs = [...contest.options.map((o) => o.bloc), ''];
  const certified = [...contest.options.map((o) => o.votes / votesTotal), 0];
  const g = Math.min(1, t / 35);
  const referendum = contest.kind === 'referendum';
  const ref = referendum ? spec.referendum : undefined;
  const movement = referendum ? { YES: ref?.movementYes ?? 0, NO: -(ref?.movementYes ?? 0) } : spec.movement;
  const opinion = applyShift(certified, blocs, movement, g).slice(0, -1);

  // 2. undecided on the published base
  const undecided = Math.min(25, Math.max(1.5,
    firm.undecided * (referendum ? 1.2 : 1) * (0.45 + 0.55 * Math.min(1, t / 42)) + rng.normal(0, 1.2))) / 100;
  let probs = [...opinion.map((q) => q * (1 - undecided)), undecided];

  // 3. shared error, province error, house lean
  const scale = ctx.sharedScale.get(firm.slug) ?? 1;
  const house = ctx.house.get(firm.slug) ?? { lean: 0, leanYes: 0 };
  if (referendum) {
    const yesBias = ref?.sharedBiasYes ?? 0;
    probs = applyShift(probs, blocs, { YES: yesBias * scale + house.leanYes }, 1);
  } else {
    probs = applyShift(probs, blocs, spec.sharedBias, scale);
    const extra = ctx.contestBias.get(contest.key) ?? 0;
    if (extra !== 0) probs = applyShift(probs, blocs, { OAK: extra / 2, LAN: -extra / 2 }, 1);
    probs = applyShift(probs, blocs, { [firm.lean.bloc]: house.lean }, 1);
  }

  // 4. sampling
  const drawn = sampleShares(probs, sampleSize / firm.designEffect, rng).map((x) => x * 100);

  // 5. publication: fold small options into `other`, round
  const labels: string[] = [];
  const values: number[] = [];
  let other = 0;
  let folded = false;
  contest.options.forEach((o, i) => {
    const share = drawn[i] ?? 0;
    if (firm.lumpBelow > 0 && share < firm.lumpBelow) {
      other += share;
      folded = true;
    } else {
      labels.push(o.key);
      values.push(share);
    }
  });
  if (folded) {
    labels.push('other');
    values.push(other);
  }
  labels.push('undecided');
  values.push(drawn[drawn.length - 1] ?? 0);
  const units = roundShares(values, firm.decimals, firm.forceHundred);

  const spellings = [firm.name, ...firm.aliases];
  const pollster = firm.aliases.length === 0
    ? firm.name
    : rng.weighted(spellings, spellings.map((_, i) => (i === 0 ? 0.6 : 0.4 / firm.aliases.length)));
  const sponsor = rng.weighted(firm.sponsors, firm.sponsors.map((s) => s.weight));

  return {
    pollster,
    firm,
    sponsor: sponsor.name,
    sponsorType: sponsor.type,
    contestKey: contest.key,
    startDay,
    endDay,
    publishedDay,
    sampleSize,
    population,
    moe,
    shares: labels.map((optionKey, i) => ({ optionKey, share: formatShare(units[i] ?? 0, firm.decimals) })),
  };
}

function buildPolls(election: DemoElection, seed: number): DemoPoll[] {
  const spec = election.spec;
  const rng = createRng(`${seed}/polls/${election.key}`);
  const effects = createRng(`${seed}/house/${election.key}`);
  const firms = DEMO_POLLSTERS.filter((f) => f.active.from <= spec.year && f.active.to >= spec.year);

  const house = new Map<string, { lean: number; leanYes: number }>();
  for (const f of firms) {
    house.set(f.slug, {
      lean: f.lean.points + effects.normal(0, 0.4),
      leanYes: f.leanYes + effects.normal(0, 0.4),
    });
  }
  const contestBias = new Map<string, number>();
  for (const c of election.contests) {
    if (c.kind === 'province') contestBias.set(c.key, effects.normal(0, spec.provinceBiasSd));
  }

  const national = election.contests.find((c) => c.kind === 'national');
  const referendum = election.contests.find((c) => c.kind === 'referendum');
  const provinces = election.contests.filter((c) => c.kind === 'province');
  const split = spec.kind === 'referendum' ? [0, 0, 1] : referendum ? [0.68, 0.24, 0.08] : [0.75, 0.25, 0];
  const [nNational = 0, nProvince = 0, nReferendum = 0] = apportion(spec.polls, split);

  const slots: Slot[] = [];
  const scheduleContest = (contest: DemoContest | undefined, total: number, weightOf: (f: DemoPollster) => number): void => {
    if (!contest || total === 0) return;
    const counts = apportion(total, firms.map(weightOf));
    firms.forEach((firm, i) => {
      for (const daysOut of schedule(firm, counts[i] ?? 0, rng)) slots.push({ firm, contest, daysOut });
    });
  };
  scheduleContest(national, nNational, (f) => f.weights.national);
  scheduleContest(referendum, nReferendum, (f) => f.weights.referendum);

  const provincialFirms = firms.filter((f) => f.weights.province > 0);
  for (let i = 0; i < nProvince && provincialFirms.length > 0; i += 1) {
    const firm = rng.weighted(provincialFirms, provincialFirms.map((f) => f.weights.province));
    const choices = provinces.filter((c) => !firm.homeProvinces || firm.homeProvinces.includes(c.provinceKey ?? ''));
    const contest = rng.weighted(choices, choices.map((c) => Math.sqrt(c.options.reduce((a, o) => a + o.votes, 0))));
    slots.push({ firm, contest, daysOut: oneDay(firm, rng) });
  }

  // Susceptibility to the shared error, normalised to a poll-weighted mean of 1.
  const meanSusceptibility = slots.reduce((acc, s) => acc + s.firm.susceptibility, 0) / Math.max(1, slots.length);
  const sharedScale = new Map(firms.map((f) => [f.slug, f.susceptibility / meanSusceptibility] as const));

  const ctx: ElectionPollContext = { election, house, contestBias, sharedScale };
  const drafts = slots.map((slot, order) => ({ order, poll: makePoll(slot, ctx, rng) }));
  const firmIndex = (f: DemoPollster): number => DEMO_POLLSTERS.indexOf(f);
  drafts.sort((a, b) =>
    a.poll.endDay - b.poll.endDay ||
    a.poll.publishedDay - b.poll.publishedDay ||
    firmIndex(a.poll.firm) - firmIndex(b.poll.firm) ||
    a.order - b.order);
  return drafts.map((d, i) => ({ key: `${election.key}-p${String(i + 1).padStart(4, '0')}`, ...d.poll }));
}

// ---------------------------------------------------------------------------------------------
// Assembly

export function buildDemoData(seed: number): DemoData {
  const elections = buildElections(seed);
  const polls = elections.flatMap((e) => buildPolls(e, seed));
  return { elections, polls };
}

export function resultsCsvOf(elections: readonly DemoElection[]): { csv: string; rows: number } {
  const out = new CsvChunks();
  out.push(csvLine(RESULTS_COLUMNS));
  let rows = 0;
  for (const e of elections) {
    for (const c of e.contests) {
      for (const o of c.options) {
        out.push(csvLine([
          e.key, e.spec.date, e.spec.name, c.jurisdiction, c.key, c.name, o.key, o.name, o.bloc, o.votes,
          c.status, c.certifiedOn, c.sourceUrl, c.kind,
        ]));
        rows += 1;
      }
    }
  }
  return { csv: out.toString(), rows };
}

export function pollsCsvOf(polls: readonly DemoPoll[]): { csv: string; rows: number } {
  const out = new CsvChunks();
  out.push(csvLine(POLLS_COLUMNS));
  let rows = 0;
  for (const p of polls) {
    const start = isoDate(p.startDay);
    const end = isoDate(p.endDay);
    const published = isoDate(p.publishedDay);
    const url = `${POLLS_HOST}/${SLUG}/${p.firm.slug}/${p.key}`;
    for (const s of p.shares) {
      out.push(csvLine([
        p.key, p.pollster, p.sponsor, p.contestKey, start, end, published, p.sampleSize, p.population,
        p.firm.mode, p.moe, s.optionKey, s.share, p.sponsorType, url,
      ]));
      rows += 1;
    }
  }
  return { csv: out.toString(), rows };
}

export function summarise(data: DemoData, seed: number, resultRows: number, pollRows: number): DemoSummary {
  const contests = data.elections.flatMap((e) => e.contests);
  const pollsByElection: Record<string, number> = {};
  for (const e of data.elections) {
    const keys = new Set(e.contests.map((c) => c.key));
    pollsByElection[e.key] = data.polls.filter((p) => keys.has(p.contestKey)).length;
  }
  return {
    country: DEMO_COUNTRY.name,
    fictional: true,
    seed,
    elections: data.elections.length,
    contests: contests.length,
    referendumContests: contests.filter((c) => c.kind === 'referendum').length,
    provisionalContests: contests.filter((c) => c.status === 'provisional').length,
    resultRows,
    polls: data.polls.length,
    pollRows,
    pollsters: new Set(data.polls.map((p) => p.firm.slug)).size,
    pollsterSpellings: new Set(data.polls.map((p) => p.pollster)).size,
    pollsByElection,
    sharedMiss: DEMO_SHARED_MISS,
  };
}
