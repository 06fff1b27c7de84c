import { NOTE_STATE_LABELS, NOTE_STATES, type NoteSummary } from '@veracast/shared-types';
import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { Alert, DataTable, LoadingState, Select, createDataTableColumnHelper } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { formatDateTime } from '../../../utils/format';
import { useNotes, type NoteListFilters } from '../api/list-notes';
import { NoteStateLabel } from './NoteStateLabel';

const column = createDataTableColumnHelper<NoteSummary>();
const columns = column.columns([
  column.accessor('title', {
    header: 'Title',
    cell: (info) => (
      <Link to={paths.note.href(info.row.original.id)} className="font-medium text-accent-700 underline hover:text-accent-900">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('state', { header: 'State', cell: (info) => <NoteStateLabel state={info.getValue()} /> }),
  column.accessor((n) => n.author.name, { id: 'author', header: 'Author' }),
  column.accessor('electionKey', { header: 'Election', cell: (info) => info.getValue() ?? '—' }),
  column.accessor('versionCount', { header: 'Versions', sortFn: 'basic' }),
  column.accessor('updatedAt', { header: 'Last change', sortFn: 'datetime', cell: (info) => formatDateTime(info.getValue()) }),
]);

const EMPTY: NoteSummary[] = [];

export interface NotesListProps {
  filters: NoteListFilters;
  onFiltersChange: (filters: NoteListFilters) => void;
}

/** Notes with filters by state, author and election; the choices come from every note the user may see. */
export function NotesList({ filters, onFiltersChange }: NotesListProps) {
  const all = useNotes({});
  const filtered = useNotes(filters);
  const authors = useMemo(() => {
    const map = new Map<number, string>();
    for (const n of all.data?.items ?? []) map.set(n.author.id, n.author.name);
    return [...map.entries()].sort((a, b) => a[1].localeCompare(b[1]));
  }, [all.data]);
  const elections = useMemo(() => [...new Set((all.data?.items ?? []).flatMap((n) => (n.electionKey ? [n.electionKey] : [])))].sort(), [all.data]);

  return (
    <div className="space-y-4">
      <div className="grid gap-3 sm:grid-cols-3">
        <Select label="State" value={filters.state ?? ''} onChange={(e) => onFiltersChange({ ...filters, state: (e.target.value || undefined) as NoteListFilters['state'] })}>
          <option value="">Any state</option>
          {NOTE_STATES.map((s) => (
            <option key={s} value={s}>
              {NOTE_STATE_LABELS[s]}
            </option>
          ))}
        </Select>
        <Select label="Author" value={filters.author ? String(filters.author) : ''} onChange={(e) => onFiltersChange({ ...filters, author: e.target.value ? Number(e.target.value) : undefined })}>
          <option value="">Anyone</option>
          {authors.map(([id, name]) => (
            <option key={id} value={id}>
              {name}
            </option>
          ))}
        </Select>
        <Select label="Election" value={filters.election ?? ''} onChange={(e) => onFiltersChange({ ...filters, election: e.target.value || undefined })}>
          <option value="">Any election</option>
          {elections.map((k) => (
            <option key={k} value={k}>
              {k}
            </option>
          ))}
        </Select>
      </div>
      {filtered.isPending ? (
        <LoadingState label="Loading notes…" />
      ) : filtered.isError ? (
        <Alert tone="danger">{describeError(filtered.error)}</Alert>
      ) : (
        <DataTable
          caption="Methodology notes"
          columns={columns}
          data={filtered.data.items ?? EMPTY}
          getRowId={(row) => String(row.id)}
          searchLabel="Search notes"
          initialSorting={[{ id: 'updatedAt', desc: true }]}
          emptyMessage="No note matches these filters."
        />
      )}
    </div>
  );
}
