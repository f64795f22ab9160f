'use client';

import { useCallback, useState } from 'react';
import type { BandFileInput } from '@/app/api/uploadthing/schema';
import { bandFileProblem } from '@/lib/storage/limits';
import { useUploadThing } from './upload-helpers';
import { uploadErrorText } from './upload-error-text';

export type UploadPhase = 'idle' | 'uploading' | 'recording' | 'done' | 'error';

export interface UploadedRevision {
  spectrumId: string;
  revisionId: string;
  revisionNumber: number;
}

export interface BandFileUploadState {
  phase: UploadPhase;
  /** 0–100, of the bytes sent. */
  progress: number;
  file: { name: string; size: number } | null;
  error: string | null;
  result: UploadedRevision | null;
}

const idle: BandFileUploadState = { phase: 'idle', progress: 0, file: null, error: null, result: null };

/**
 * One band file through the upload route (`bandFile`): a check of name and size first (the same
 * rule the route applies), fine-grained progress while the bytes go to storage, then the
 * server's answer once it has recorded the revision and queued screening.
 */
export function useBandFileUpload() {
  const [state, setState] = useState<BandFileUploadState>(idle);
  const fail = (message: string) => setState((s) => ({ ...s, phase: 'error', error: message }));

  const { startUpload } = useUploadThing('bandFile', {
    uploadProgressGranularity: 'fine',
    onUploadProgress: (p) =>
      // At 100 % the bytes are stored; the server still records the revision before answering.
      setState((s) => (s.phase === 'uploading' ? { ...s, progress: p, phase: p >= 100 ? 'recording' : 'uploading' } : s)),
    onUploadError: (e) => fail(uploadErrorText(e)),
  });

  const start = useCallback(
    async (file: File, input: BandFileInput): Promise<UploadedRevision | null> => {
      const problem = bandFileProblem(file);
      if (problem) {
        setState({ ...idle, phase: 'error', file: { name: file.name, size: file.size }, error: problem.message });
        return null;
      }
      setState({ ...idle, phase: 'uploading', file: { name: file.name, size: file.size } });
      const res = await startUpload([file], input);
      const data = res?.[0]?.serverData;
      if (!data) return null; // onUploadError has said why
      if ('error' in data) {
        fail(data.error.message);
        return null;
      }
      setState((s) => ({ ...s, phase: 'done', progress: 100, result: data }));
      return data;
    },
    [startUpload],
  );

  const reset = useCallback(() => setState(idle), []);
  return { state, start, reset, busy: state.phase === 'uploading' || state.phase === 'recording' };
}
