import { POPULATION_LABELS, SPONSOR_TYPE_LABELS } from '@veracast/shared-types';
import type { ReactNode } from 'react';
import { formatDate } from '../../../utils/format';
import type { PollDetail } from '../api/get-poll';
import { fixed, signed } from '../format';

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid gap-1 py-1.5 sm:grid-cols-[12rem_1fr] sm:gap-4">
      <dt className="text-sm font-medium text-ink-700">{label}</dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}

function ExternalLink({ href }: { href: string }) {
  return (
    <a href={href} target="_blank" rel="noopener noreferrer" className="break-all text-accent-700 underline hover:text-accent-900">
      {href}
    </a>
  );
}

/** What the poll published: who, when, how, and how many. */
export function PollFacts({ poll }: { poll: PollDetail }) {
  return (
    <dl className="divide-y divide-ink-100">
      <Fact label="Pollster">{poll.pollster}</Fact>
      <Fact label="Sponsor">
        {poll.sponsor ?? 'Not stated'}
        {poll.sponsorType && ` (${SPONSOR_TYPE_LABELS[poll.sponsorType]})`}
      </Fact>
      <Fact label="Fieldwork">
        {formatDate(poll.fieldworkStart)} to {formatDate(poll.fieldworkEnd)}
      </Fact>
      <Fact label="Published">{formatDate(poll.publishedOn)}</Fact>
      <Fact label="Sample size">{poll.sampleSize.toLocaleString('en-GB')}</Fact>
      <Fact label="Population">{POPULATION_LABELS[poll.population] ?? poll.population}</Fact>
      <Fact label="Mode">{poll.mode}</Fact>
      <Fact label="Stated margin of error">{poll.moe === null ? 'Not stated' : `±${fixed(poll.moe, 1)} pts (one share, 95%)`}</Fact>
      <Fact label="Kind">
        {poll.isHeadline ? 'Headline figures' : 'Not the headline figures of its study'}
        {poll.tracking ? ', tracking poll' : ''}
        {poll.studyKey ? ` · study ${poll.studyKey}` : ''}
      </Fact>
      <Fact label="Disclosure">
        {Math.round(poll.disclosure.completeness * 100)}% of the disclosure items published (a separate dimension from accuracy)
      </Fact>
      {poll.sourceUrl && (
        <Fact label="Source">
          <ExternalLink href={poll.sourceUrl} />
        </Fact>
      )}
    </dl>
  );
}

/** The poll's shares beside the certified shares, option by option. */
export function PollSharesTable({ poll, refA, refB }: { poll: PollDetail; refA?: string | null; refB?: string | null }) {
  const options = poll.contest.options;
  const known = new Set(options.map((o) => o.key));
  const extra = Object.keys(poll.shares).filter((key) => !known.has(key));
  const role = (key: string) => (key === refA ? ' (A)' : key === refB ? ' (B)' : '');
  return (
    <div className="overflow-x-auto rounded-lg border border-ink-200">
      <table className="min-w-full divide-y divide-ink-200 text-sm">
        <caption className="sr-only">Poll shares and certified shares by option</caption>
        <thead className="bg-ink-100 text-left">
          <tr>
            <th scope="col" className="px-3 py-2 font-semibold">Option</th>
            <th scope="col" className="px-3 py-2 font-semibold">Bloc</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Poll (pts)</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Certified (pts)</th>
            <th scope="col" className="px-3 py-2 text-right font-semibold">Poll − certified (pts)</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100 tabular-nums">
          {options.map((o) => {
            const share = poll.shares[o.key];
            return (
              <tr key={o.key}>
                <th scope="row" className="px-3 py-1.5 text-left font-medium">
                  {o.name}
                  {role(o.key)} <span className="font-mono text-xs text-ink-500">{o.key}</span>
                </th>
                <td className="px-3 py-1.5">{o.bloc ?? '—'}</td>
                <td className="px-3 py-1.5 text-right">{fixed(share, 1)}</td>
                <td className="px-3 py-1.5 text-right">{fixed(o.share, 2)}</td>
                <td className="px-3 py-1.5 text-right">{share !== undefined && o.share !== null ? signed(share - o.share) : '—'}</td>
              </tr>
            );
          })}
          {extra.map((key) => (
            <tr key={key}>
              <th scope="row" className="px-3 py-1.5 text-left font-medium">
                {key === 'undecided' ? 'Undecided, refused, no answer' : key === 'other' ? 'Other' : key}{' '}
                <span className="font-mono text-xs text-ink-500">{key}</span>
              </th>
              <td className="px-3 py-1.5">—</td>
              <td className="px-3 py-1.5 text-right">{fixed(poll.shares[key], 1)}</td>
              <td className="px-3 py-1.5 text-right">—</td>
              <td className="px-3 py-1.5 text-right">—</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** Where the certified result comes from. */
export function ContestResultFacts({ poll }: { poll: PollDetail }) {
  const c = poll.contest;
  return (
    <dl className="divide-y divide-ink-100">
      <Fact label="Contest">
        {c.name} <span className="font-mono text-xs text-ink-500">{c.key}</span>
      </Fact>
      <Fact label="Election">
        {c.electionName} ({formatDate(c.electionDate)})
      </Fact>
      <Fact label="Result status">
        {c.status === 'certified' ? `Certified${c.certifiedOn ? ` on ${formatDate(c.certifiedOn)}` : ''}` : c.status === 'provisional' ? 'Provisional: not certified yet' : 'No result yet'}
        {c.certifyingBody ? ` by ${c.certifyingBody}` : ''}
      </Fact>
      {c.sourceUrl && (
        <Fact label="Result source">
          <ExternalLink href={c.sourceUrl} />
        </Fact>
      )}
      {c.validVotes !== null && <Fact label="Valid votes">{c.validVotes.toLocaleString('en-GB')}</Fact>}
    </dl>
  );
}
