import type { QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { Alert, LoadingState } from '../../components/ui';
import { PublicNoteView, publicNoteQueryOptions, publicNoteSlugSchema, usePublicNote } from '../../features/notes';
import { describeError, isApiError } from '../../lib/api-client';

/** Starts loading the published note with the navigation; no sign-in is needed. */
export function publicNoteLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const slug = publicNoteSlugSchema.safeParse(params.slug);
    if (slug.success) await queryClient.prefetchQuery(publicNoteQueryOptions(slug.data));
    return null;
  };
}

function Wide({ children }: { children: ReactNode }) {
  // The public frame is narrow (forms); a note needs the width of a page.
  return <div className="relative left-1/2 w-[min(60rem,calc(100vw-2rem))] -translate-x-1/2">{children}</div>;
}

export function PublicNoteRoute() {
  const slug = publicNoteSlugSchema.safeParse(useParams().slug);
  const note = usePublicNote(slug.success ? slug.data : '');
  if (!slug.success || (note.isError && isApiError(note.error) && note.error.status === 404)) {
    return (
      <Wide>
        <title>Note not found · Veracast</title>
        <Alert tone="info" title="No published note at this address">It may have a different address, or it is not published.</Alert>
      </Wide>
    );
  }
  if (note.isPending) return <LoadingState label="Loading the note…" />;
  if (note.isError) return <Alert tone="danger">{describeError(note.error)}</Alert>;
  return (
    <Wide>
      <title>{`${note.data.title} · Veracast`}</title>
      <PublicNoteView note={note.data} />
    </Wide>
  );
}
