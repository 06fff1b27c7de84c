import type { AuditDto } from '@veracast/shared-types';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { CopyButton } from '../../../components/ui';
import { paths } from '../../../lib/paths';
import { formatDate, formatDateTime } from '../../../utils/format';
import { METHOD_ANCHORS, type MethodAnchor } from '../method-catalogue';
import { UNDECIDED_LABELS } from '../settings-text';
import { FormulaLink } from './FormulaLink';

function Row({ label, anchor, children }: { label: string; anchor?: MethodAnchor; children: ReactNode }) {
  return (
    <div className="grid gap-1 py-2 sm:grid-cols-[14rem_1fr] sm:gap-4">
      <dt className="text-sm font-medium text-ink-700">
        {label} {anchor && <span className="text-xs font-normal">(<FormulaLink anchor={anchor} label="how" />)</span>}
      </dt>
      <dd className="text-sm text-ink-900">{children}</dd>
    </div>
  );
}

/** Everything the audit was computed from, in plain view: settings, elections, data hash, version. */
export function AuditSettingsPanel({ audit }: { audit: AuditDto }) {
  const s = audit.settings;
  return (
    <dl className="divide-y divide-ink-100">
      <Row label="Elections">
        <ul className="space-y-1">
          {audit.elections.map((e) => (
            <li key={e.key}>
              {e.name} <span className="text-ink-600">({formatDate(e.date)})</span>{' '}
              <span className="text-ink-600">
                · bloc A {e.blocA ?? '—'}, bloc B {e.blocB ?? '—'}
              </span>
            </li>
          ))}
        </ul>
      </Row>
      <Row label="Window" anchor={METHOD_ANCHORS.window}>
        Fieldwork ended 0 to {s.windowDays} days before election day
      </Row>
      <Row label="Polls counted" anchor={METHOD_ANCHORS.finalPoll}>
        {s.finalOnly ? 'Each pollster’s final poll per contest' : 'Every poll in the window'}
      </Row>
      <Row label="Undecided treatment" anchor={METHOD_ANCHORS.undecided}>
        {UNDECIDED_LABELS[s.undecided]}
      </Row>
      <Row label="Design effect" anchor={METHOD_ANCHORS.designEffect}>
        {s.designEffect} {s.designEffect === 1 ? '(simple random sampling)' : ''}
      </Row>
      <Row label="Minimum polls to rank a firm" anchor={METHOD_ANCHORS.minPolls}>
        {s.minPolls}
      </Row>
      <Row label="Data hash" anchor={METHOD_ANCHORS.dataHash}>
        <span className="flex flex-wrap items-center gap-2">
          <code className="font-mono text-xs break-all text-ink-900">{audit.dataHash}</code>
          <CopyButton value={audit.dataHash} label="Copy hash" />
        </span>
      </Row>
      <Row label="Library version">
        <code className="font-mono text-xs">{audit.coreVersion}</code>
      </Row>
      <Row label="Computed">
        {formatDateTime(audit.createdAt)}
        {audit.createdBy ? ` by ${audit.createdBy}` : ''}
        {audit.rerunOf !== null && (
          <>
            {' '}
            · re-run of{' '}
            <Link to={paths.audit.href(audit.rerunOf)} className="font-medium text-accent-700 underline">
              audit {audit.rerunOf}
            </Link>
          </>
        )}
      </Row>
    </dl>
  );
}
