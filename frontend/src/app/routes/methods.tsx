import { useEffect } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { PageHeader } from '../../components/ui';
import { METHOD_SECTIONS, type MethodEntry, type MethodSource } from '../../features/audits';
import { paths } from '../../lib/paths';

const SOURCE_LABELS: Record<MethodSource['kind'], string> = {
  published: 'Published',
  memory: 'Recalled, not re-checked',
  practice: 'Practice of the trade',
};

function Entry({ entry }: { entry: MethodEntry }) {
  return (
    <article
      id={entry.anchor}
      tabIndex={-1}
      aria-labelledby={`${entry.anchor}-name`}
      className="scroll-mt-6 rounded-lg border border-ink-200 bg-white px-5 py-4 shadow-sm focus:outline-none target:border-accent-600 target:ring-2 target:ring-accent-200"
    >
      <h3 id={`${entry.anchor}-name`} className="text-base font-semibold text-ink-900">
        <Link to={paths.methods.href(entry.anchor)} className="hover:underline">
          {entry.name}
        </Link>
      </h3>
      <p className="mt-1 text-ink-700">{entry.measures}</p>
      <pre className="mt-3 overflow-x-auto rounded-md bg-ink-100 px-3 py-2 font-mono text-sm whitespace-pre-wrap text-ink-900">
        {entry.formula.join('\n')}
      </pre>
      <p className="mt-2 text-sm text-ink-700">
        <span className="font-medium">Unit and sign: </span>
        {entry.unit}
      </p>
      {entry.notes && (
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink-700">
          {entry.notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
      )}
      <div className="mt-3 text-sm">
        <p className="font-medium text-ink-800">{entry.sources.length === 1 ? 'Source' : 'Sources'}</p>
        <ul className="mt-1 space-y-0.5 text-ink-700">
          {entry.sources.map((source) => (
            <li key={source.citation}>
              <span className="font-medium">{SOURCE_LABELS[source.kind]}:</span> {source.citation}
            </li>
          ))}
        </ul>
      </div>
    </article>
  );
}

/** Every formula Veracast shows, with its source; each metric has an anchor figures link to. */
export function MethodsRoute() {
  const { hash } = useLocation();

  useEffect(() => {
    if (!hash) return;
    const jump = () => {
      const target = document.getElementById(decodeURIComponent(hash.slice(1)));
      if (!target) return;
      target.scrollIntoView({ block: 'start' });
      target.focus({ preventScroll: true });
    };
    jump();
    // On a fresh page load the router restores a saved scroll position once its data has settled,
    // which lands after this effect; jump again once that has happened.
    const timer = setTimeout(jump, 150);
    return () => clearTimeout(timer);
  }, [hash]);

  return (
    <div className="space-y-8">
      <title>Methods · Veracast</title>
      <PageHeader
        title="Methods"
        description="Every formula behind the figures, with its source. Shares and errors are in points (0–100) unless a formula says proportions; z = 1.959964."
      />
      <nav aria-label="Sections of the methods" className="rounded-lg border border-ink-200 bg-white px-5 py-4">
        <ul className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2 lg:grid-cols-3">
          {METHOD_SECTIONS.map((section) => (
            <li key={section.id}>
              <Link to={paths.methods.href(section.id)} className="font-medium text-accent-700 underline hover:text-accent-900">
                {section.title}
              </Link>
            </li>
          ))}
        </ul>
      </nav>
      {METHOD_SECTIONS.map((section) => (
        <section key={section.id} id={section.id} aria-labelledby={`${section.id}-title`} className="scroll-mt-6 space-y-3">
          <h2 id={`${section.id}-title`} className="text-lg font-semibold text-ink-900">
            {section.title}
          </h2>
          <div className="grid gap-3">
            {section.entries.map((entry) => (
              <Entry key={entry.anchor} entry={entry} />
            ))}
          </div>
        </section>
      ))}
      <p className="text-sm text-ink-600">
        Source labels: <strong>Published</strong> values come from the cited work; <strong>Recalled</strong> ones were taken from
        memory of the cited work and not re-checked against it; <strong>Practice of the trade</strong> marks common practice with
        no single source.
      </p>
    </div>
  );
}
