import type { QueryClient } from '@tanstack/react-query';
import { roleAtLeast } from '@veracast/shared-types';
import { useNavigate, useParams, useSearchParams, type LoaderFunctionArgs, type RouteObject } from 'react-router-dom';
import { Alert, LinkButton, LoadingState, PageHeader } from '../../../components/ui';
import { RequireRole, useCurrentUser } from '../../../features/auth';
import {
  NewNoteForm,
  NoteEditor,
  NotesList,
  NoteView,
  VersionCompare,
  auditChoicesQueryOptions,
  noteIdSchema,
  noteListFiltersSchema,
  noteQueryOptions,
  noteVersionsQueryOptions,
  notesQueryOptions,
  useNote,
  type NoteListFilters,
} from '../../../features/notes';
import { describeError, isApiError } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { prefetchLoader } from '../../loaders';
import { NotFoundRoute } from '../not-found';

function filtersFrom(params: URLSearchParams): NoteListFilters {
  return noteListFiltersSchema.parse({ state: params.get('state') ?? undefined, author: params.get('author') ?? undefined, election: params.get('election') ?? undefined });
}

export function NotesListRoute() {
  const [params, setParams] = useSearchParams();
  const { data: user } = useCurrentUser();
  const filters = filtersFrom(params);
  return (
    <>
      <title>Notes · Veracast</title>
      <PageHeader
        title="Methodology notes"
        description="Notes explain an audit and publish its numbers. A reviewer other than the author approves each one before it goes public."
        actions={user && roleAtLeast(user.role, 'analyst') ? <LinkButton to={paths.noteNew.href()} variant="primary">New note</LinkButton> : undefined}
      />
      <NotesList
        filters={filters}
        onFiltersChange={(next) => {
          const q = new URLSearchParams();
          if (next.state) q.set('state', next.state);
          if (next.author) q.set('author', String(next.author));
          if (next.election) q.set('election', next.election);
          setParams(q, { replace: true });
        }}
      />
    </>
  );
}

export function NewNoteRoute() {
  const navigate = useNavigate();
  return (
    <RequireRole minimum="analyst">
      <title>New note · Veracast</title>
      <PageHeader title="New note" description="Give the note a title; the editor opens with a short template." />
      <NewNoteForm onCreated={(id) => navigate(paths.noteEdit.href(id))} />
    </RequireRole>
  );
}

function useNoteFromParams() {
  const parsed = noteIdSchema.safeParse(useParams().noteId);
  const note = useNote(parsed.success ? parsed.data : 0);
  return { id: parsed.success ? parsed.data : null, note };
}

function NoteProblem({ error }: { error: unknown }) {
  if (isApiError(error) && error.status === 404) return <NotFoundRoute />;
  return <Alert tone="danger">{describeError(error)}</Alert>;
}

export function NoteRoute() {
  const { id, note } = useNoteFromParams();
  if (id === null) return <NotFoundRoute />;
  if (note.isPending) return <LoadingState label="Loading the note…" />;
  if (note.isError) return <NoteProblem error={note.error} />;
  return (
    <>
      <title>{`${note.data.title} · Veracast`}</title>
      <PageHeader title={note.data.title} />
      <NoteView note={note.data} />
    </>
  );
}

export function NoteEditRoute() {
  const { id, note } = useNoteFromParams();
  const navigate = useNavigate();
  if (id === null) return <NotFoundRoute />;
  return (
    <RequireRole minimum="analyst">
      {note.isPending ? (
        <LoadingState label="Loading the note…" />
      ) : note.isError ? (
        <NoteProblem error={note.error} />
      ) : (
        <>
          <title>{`Edit ${note.data.title} · Veracast`}</title>
          <PageHeader title={`Edit: ${note.data.title}`} description="Each save keeps a version. Blocks show the audits’ stored numbers." />
          <NoteEditor key={note.data.id} note={note.data} onSubmitted={() => navigate(paths.note.href(id))} />
        </>
      )}
    </RequireRole>
  );
}

export function NoteVersionsRoute() {
  const { id, note } = useNoteFromParams();
  const [params, setParams] = useSearchParams();
  if (id === null) return <NotFoundRoute />;
  const num = (v: string | null) => (v && /^[1-9][0-9]*$/.test(v) ? Number(v) : null);
  return (
    <>
      <title>Versions · Veracast</title>
      <PageHeader title={note.data ? `Versions of “${note.data.title}”` : 'Versions'} description="Two versions side by side; lines only on one side are marked." />
      {note.isError ? (
        <NoteProblem error={note.error} />
      ) : (
        <VersionCompare noteId={id} a={num(params.get('a'))} b={num(params.get('b'))} onChange={(a, b) => setParams({ a: String(a), b: String(b) }, { replace: true })} />
      )}
    </>
  );
}

const withNoteId = (queryClient: QueryClient, minimum: 'viewer' | 'analyst', extra: (id: number) => ReturnType<typeof auditChoicesQueryOptions | typeof noteVersionsQueryOptions>[] = () => []) =>
  (args: LoaderFunctionArgs) => {
    const id = noteIdSchema.safeParse(args.params.noteId);
    return prefetchLoader(queryClient, minimum, () => (id.success ? [noteQueryOptions(id.data), ...extra(id.data)] : []))();
  };

/** Routes of the Notes area; the router spreads them into the signed-in shell. */
export function notesRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    { path: paths.notes.path, loader: prefetchLoader(queryClient, 'viewer', () => [notesQueryOptions({})]), element: <NotesListRoute /> },
    { path: paths.noteNew.path, element: <NewNoteRoute /> },
    { path: paths.note.path, loader: withNoteId(queryClient, 'viewer'), element: <NoteRoute /> },
    { path: paths.noteEdit.path, loader: withNoteId(queryClient, 'analyst', () => [auditChoicesQueryOptions()]), element: <NoteEditRoute /> },
    { path: paths.noteVersions.path, loader: withNoteId(queryClient, 'viewer', (id) => [noteVersionsQueryOptions(id)]), element: <NoteVersionsRoute /> },
  ];
}
