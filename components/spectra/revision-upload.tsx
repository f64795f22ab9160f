'use client';

import { useQueryClient } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Panel } from '@/components/ui/panel';
import { spectraKeys } from '@/lib/client/spectra-api';
import { useBandFileUpload } from '@/lib/client/use-band-file-upload';
import { bandFileProblem } from '@/lib/storage/limits';
import { BandFileDrop } from './band-file-drop';
import { UploadProgress } from './upload-progress';
import { controlClasses } from '@/components/ui/control-classes';

/** The submitter's new revision: a file and a note on what changed. Earlier approvals are cleared. */
export function RevisionUpload({ spectrumId, nextNumber }: { spectrumId: string; nextNumber: number }) {
  const id = useId();
  const queryClient = useQueryClient();
  const upload = useBandFileUpload();
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [note, setNote] = useState('');

  const choose = (f: File | null) => {
    setFile(f);
    setFileError(f ? (bandFileProblem(f)?.message ?? null) : null);
    upload.reset();
  };

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    if (!file) return setFileError('Choose the band file of the new revision.');
    if (fileError) return;
    const done = await upload.start(file, { spectrumId, note: note.trim() || null });
    if (done) {
      setFile(null);
      setNote('');
      await queryClient.invalidateQueries({ queryKey: spectraKeys.detail(spectrumId) });
      void queryClient.invalidateQueries({ queryKey: ['spectra', 'list'] });
    }
  };

  return (
    <Panel title={`Upload revision ${nextNumber}`} description="Replaces the current file for review; earlier approvals are cleared." data-testid="revision-upload">
      <form onSubmit={submit} noValidate className="flex flex-col gap-3">
        <BandFileDrop file={file} onFile={choose} disabled={upload.busy} error={fileError} label="New band file" />
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-note`} className="text-xs font-semibold text-paper-800">
            What changed
          </label>
          <textarea
            id={`${id}-note`}
            rows={2}
            maxLength={10_000}
            value={note}
            disabled={upload.busy}
            onChange={(e) => setNote(e.target.value)}
            className={controlClasses(false, 'py-2 leading-5')}
            placeholder="e.g. larger supercell, acoustic sum rule imposed"
            data-testid="revision-note"
          />
        </div>
        {upload.state.file && upload.state.phase !== 'idle' && upload.state.phase !== 'done' && (
          <UploadProgress name={upload.state.file.name} size={upload.state.file.size} progress={upload.state.progress} phase={upload.state.phase} />
        )}
        <div aria-live="polite">
          {/* Once recorded, the bar would read as a file chosen for the next revision: say what happened instead. */}
          {upload.state.phase === 'done' && upload.state.result && upload.state.file && (
            <Alert tone="success" data-testid="revision-uploaded">
              Revision {upload.state.result.revisionNumber} uploaded from <span className="font-mono">{upload.state.file.name}</span>; screening runs now.
            </Alert>
          )}
          {upload.state.phase === 'error' && upload.state.error && (
            <Alert tone="error" title="The revision was not uploaded" data-testid="upload-error">
              {upload.state.error}
            </Alert>
          )}
        </div>
        <div className="flex justify-end">
          <Button type="submit" disabled={upload.busy} data-testid="upload-revision">
            {upload.busy ? 'Uploading…' : 'Upload revision'}
          </Button>
        </div>
      </form>
    </Panel>
  );
}
