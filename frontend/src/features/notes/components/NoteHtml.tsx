import 'katex/dist/katex.min.css';
import '../note-content.css';
import { cn } from '../../../lib/cn';

/**
 * Shows a note as the server rendered it. The HTML is only ever the server's sanitised output
 * (`POST /notes/preview`, a stored version, or a published page): never text typed in the browser.
 */
export function NoteHtml({ html, className, label }: { html: string; className?: string; label?: string }) {
  return <div className={cn('vc-note', className)} aria-label={label} dangerouslySetInnerHTML={{ __html: html }} />;
}
