import { useId, useState } from 'react';
import { Alert, Button } from '../../../components/ui';
import { describeError } from '../../../lib/api-client';
import type { ContestDetail } from '../api/get-contest';
import { sourceDocumentInputSchema, sourceDocumentUrl, useUploadSourceDocument } from '../api/upload-source-document';

export interface SourceDocumentPanelProps {
  contest: ContestDetail;
  /** Reviewers attach the document; everyone may download it. */
  canAttach: boolean;
}

/** The official document the certified result was taken from: download it, or attach it. */
export function SourceDocumentPanel({ contest, canAttach }: SourceDocumentPanelProps) {
  const upload = useUploadSourceDocument();
  const inputId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  function submit() {
    const parsed = sourceDocumentInputSchema.safeParse({ file });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message ?? 'choose a file');
      return;
    }
    setProblem(null);
    upload.mutate({ contestKey: contest.key, file: parsed.data.file }, { onSuccess: () => setFile(null) });
  }

  return (
    <div className="space-y-3 text-sm">
      <p>
        {contest.sourceUrl ? (
          <>
            Source:{' '}
            <a href={contest.sourceUrl} rel="noreferrer noopener" target="_blank" className="break-all text-accent-700 underline">
              {contest.sourceUrl}
            </a>
          </>
        ) : (
          <span className="text-ink-600">No source URL recorded.</span>
        )}
      </p>
      {contest.hasSourceDocument ? (
        <p>
          <a href={sourceDocumentUrl(contest.key)} download className="font-medium text-accent-700 underline">
            Download the source document
          </a>
        </p>
      ) : (
        <p className="text-ink-600">No source document is attached.</p>
      )}
      {canAttach && (
        <div className="space-y-2">
          {upload.isError && <Alert tone="danger">{describeError(upload.error)}</Alert>}
          {upload.isSuccess && <Alert tone="success">The document was attached and the change logged.</Alert>}
          <label htmlFor={inputId} className="block font-medium text-ink-800">
            Attach the official document (PDF, PNG or JPEG, up to 20 MB)
          </label>
          <input
            id={inputId}
            type="file"
            accept="application/pdf,image/png,image/jpeg"
            aria-invalid={problem ? true : undefined}
            onChange={(event) => setFile(event.target.files?.[0] ?? null)}
            className="block text-sm file:mr-3 file:rounded-md file:border file:border-ink-300 file:bg-white file:px-3 file:py-1.5"
          />
          {problem && <p className="font-medium text-danger-700">{problem}</p>}
          <Button size="sm" variant="secondary" onClick={submit} busy={upload.isPending} busyText="Uploading…">
            Attach document
          </Button>
        </div>
      )}
    </div>
  );
}
