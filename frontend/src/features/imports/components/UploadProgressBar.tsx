import { Button } from '../../../components/ui';
import type { UploadProgress } from '../api/send-import';
import { formatBytes } from '../parse-file';

/** The upload's progress, then a busy state while the server validates and writes. */
export function UploadProgressBar({ progress, onCancel }: { progress: UploadProgress | null; onCancel?: () => void }) {
  const uploading = progress?.phase === 'uploading';
  const percent = uploading && progress.total > 0 ? Math.round((progress.loaded / progress.total) * 100) : null;
  return (
    <div className="space-y-2 rounded-md border border-ink-200 bg-ink-50 px-4 py-3">
      <p role="status" aria-live="polite" className="text-sm font-medium text-ink-800">
        {progress === null
          ? 'Starting the upload…'
          : uploading
            ? `Uploading: ${percent ?? 0}% (${formatBytes(progress.loaded)} of ${formatBytes(progress.total)})`
            : 'Uploaded. The server is validating and writing…'}
      </p>
      {uploading || progress === null ? (
        <div
          role="progressbar"
          aria-label="Upload progress"
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={percent ?? 0}
          className="h-2 overflow-hidden rounded bg-ink-200"
        >
          <div className="h-full bg-accent-700 transition-[width]" style={{ width: `${percent ?? 0}%` }} />
        </div>
      ) : (
        <div role="progressbar" aria-label="Server processing" aria-busy="true" className="h-2 overflow-hidden rounded bg-ink-200">
          <div className="h-full w-1/3 animate-pulse bg-accent-600" />
        </div>
      )}
      {onCancel && uploading && (
        <Button size="sm" variant="ghost" onClick={onCancel}>
          Cancel the upload
        </Button>
      )}
    </div>
  );
}
