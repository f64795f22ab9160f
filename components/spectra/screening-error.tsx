import { Alert } from '@/components/ui/alert';
import type { ScreeningDto } from '@/lib/client/spectra-types';

type ErrorInfo = Extract<ScreeningDto, { status: 'error' }>['error'];

/** Why the file could not be read: where (line, column), what was expected and what was found. */
export function ScreeningError({ error, fileName }: { error: ErrorInfo; fileName?: string }) {
  return (
    <Alert tone="error" title="The file could not be read, so it was not screened" data-testid="screening-error">
      <p>{error.message}</p>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 text-xs">
        {fileName && (
          <>
            <dt className="font-semibold">File</dt>
            <dd className="font-mono">{fileName}</dd>
          </>
        )}
        <dt className="font-semibold">Line</dt>
        <dd className="tabular" data-testid="screening-error-line">{error.line ?? '—'}</dd>
        <dt className="font-semibold">Column</dt>
        <dd className="tabular" data-testid="screening-error-column">{error.column ?? '—'}</dd>
        <dt className="font-semibold">Expected</dt>
        <dd data-testid="screening-error-expected">{error.expected ?? '—'}</dd>
        {error.found && (
          <>
            <dt className="font-semibold">Found</dt>
            <dd className="font-mono">{error.found}</dd>
          </>
        )}
      </dl>
      <p className="mt-2 text-xs">Fix the file and upload it again as a new revision.</p>
    </Alert>
  );
}
