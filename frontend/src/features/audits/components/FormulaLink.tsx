import { Link } from 'react-router-dom';
import { paths } from '../../../lib/paths';
import { methodEntry, type MethodAnchor } from '../method-catalogue';

/** "Formula" link to a metric's entry on the methods page; its accessible name names the metric. */
export function FormulaLink({ anchor, label = 'Formula' }: { anchor: MethodAnchor; label?: string }) {
  const entry = methodEntry(anchor);
  return (
    <Link
      to={paths.methods.href(anchor)}
      className="font-medium whitespace-nowrap text-accent-700 underline hover:text-accent-900"
      aria-label={`${label}: ${entry.name}`}
    >
      {label}
    </Link>
  );
}

/** The one line of what a metric measures, followed by its formula link. */
export function MetricExplanation({ anchor, text }: { anchor: MethodAnchor; text?: string }) {
  return (
    <span>
      {text ?? methodEntry(anchor).measures} <FormulaLink anchor={anchor} />
    </span>
  );
}
