'use client';

import { useDropzone } from '@uploadthing/react';
import { useId } from 'react';
import { cx } from '@/components/ui/cx';
import { BAND_FILE_EXTENSIONS, MAX_BAND_FILE_BYTES } from '@/lib/storage/limits';
import { formatBytes } from './format-bytes';

const ACCEPT_ATTR = BAND_FILE_EXTENSIONS.join(',');

export interface BandFileDropProps {
  file: File | null;
  onFile: (file: File | null) => void;
  disabled?: boolean;
  /** Why the chosen file cannot be used, or that one is missing. */
  error?: string | null;
  label?: string;
}

/**
 * Where a band file is dropped or chosen. Every dropped file reaches `onFile` (no silent
 * filtering by type or size): the caller checks it and says in words what is wrong.
 */
export function BandFileDrop({ file, onFile, disabled, error, label = 'Band file' }: BandFileDropProps) {
  const id = useId();
  const { getRootProps, getInputProps, isDragActive } = useDropzone({
    multiple: false,
    disabled,
    onDrop: (files) => onFile(files[0] ?? null),
  });
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;

  return (
    <div className="flex flex-col gap-1.5">
      <span className="text-xs font-semibold text-paper-800" id={`${id}-label`}>
        {label}
      </span>
      <div
        {...getRootProps()}
        aria-labelledby={`${id}-label`}
        aria-describedby={cx(hintId, error && errorId) || undefined}
        className={cx(
          'flex cursor-pointer flex-col items-center gap-2 rounded-lg border-2 border-dashed px-4 py-6 text-center transition-colors',
          disabled && 'cursor-not-allowed opacity-60',
          error ? 'border-brick-600 bg-brick-50/40' : isDragActive ? 'border-ink-600 bg-ink-50' : 'border-paper-300 bg-paper-50 hover:border-ink-400',
        )}
        data-testid="band-file-drop"
      >
        <input {...getInputProps()} accept={ACCEPT_ATTR} data-testid="band-file-input" />
        <DropMark />
        {file ? (
          <p className="text-sm text-paper-900">
            <span className="font-mono">{file.name}</span> <span className="tabular text-paper-600">({formatBytes(file.size)})</span>
          </p>
        ) : (
          <p className="text-sm text-paper-800">
            {isDragActive ? 'Drop the file here' : (
              <>
                Drop a band file here, or <span className="font-semibold text-ink-700 underline decoration-ink-300 underline-offset-2">choose one</span>
              </>
            )}
          </p>
        )}
        <p id={hintId} className="text-xs text-paper-600" data-testid="band-file-rules">
          One file · {BAND_FILE_EXTENSIONS.join(' ')} · up to {formatBytes(MAX_BAND_FILE_BYTES)}
        </p>
      </div>
      {error && (
        <p id={errorId} role="alert" className="text-xs font-medium text-brick-700" data-testid="band-file-error">
          {error}
        </p>
      )}
    </div>
  );
}

function DropMark() {
  // A small band sketch with an arrow into it: a file of branches arriving.
  return (
    <svg viewBox="0 0 40 28" className="h-7 w-10 text-paper-500" aria-hidden="true">
      <path d="M2 24 C 10 10, 18 8, 26 14 S 36 20, 38 12" fill="none" stroke="currentColor" strokeWidth="1.5" />
      <path d="M2 24 C 12 20, 22 22, 38 18" fill="none" stroke="currentColor" strokeWidth="1.5" strokeDasharray="2.5 2" />
      <path d="M20 1 V11 M16 7.5 L20 11.5 L24 7.5" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" strokeLinejoin="round" className="text-ink-700" />
    </svg>
  );
}
