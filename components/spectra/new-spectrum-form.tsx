'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button, buttonClasses } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Input } from '@/components/ui/input';
import { Panel } from '@/components/ui/panel';
import { bandFileProblem } from '@/lib/storage/limits';
import { useBandFileUpload } from '@/lib/client/use-band-file-upload';
import { BandFileDrop } from './band-file-drop';
import { emptyNewSpectrum, newSpectrumForm, type NewSpectrumValues } from './new-spectrum-schema';
import { TextArea } from './text-area';
import { UploadProgress } from './upload-progress';

const errs = (m?: string) => (m ? [m] : undefined);

/**
 * Metadata and one band file. Submitting checks the form, then sends the file with the
 * metadata as the upload's input; the server creates the spectrum and its first revision only
 * when the file is stored, so a refused or interrupted upload leaves nothing behind.
 */
export function NewSpectrumForm({ group }: { group: string }) {
  const router = useRouter();
  const upload = useBandFileUpload();
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<NewSpectrumValues>({ resolver: zodResolver(newSpectrumForm), defaultValues: emptyNewSpectrum });

  const chooseFile = (f: File | null) => {
    setFile(f);
    setFileError(f ? (bandFileProblem(f)?.message ?? null) : null);
    upload.reset();
  };

  const onValid = async (values: NewSpectrumValues) => {
    if (!file) {
      setFileError('Choose the band file to upload.');
      return;
    }
    if (fileError) return;
    const done = await upload.start(file, { group, ...values });
    if (done) router.push(`/groups/${group}/spectra/${done.spectrumId}`);
  };
  // The file is checked even when the metadata has errors, so both are shown at once.
  const onInvalid = () => {
    if (!file) setFileError('Choose the band file to upload.');
  };

  const busy = upload.busy || upload.state.phase === 'done';

  return (
    <form onSubmit={handleSubmit(onValid, onInvalid)} noValidate className="grid gap-5 lg:grid-cols-[1fr_22rem]" data-testid="new-spectrum-form">
      <Panel title="About the calculation" description="Free text: write it the way your group does.">
        <fieldset disabled={busy} className="grid gap-4 sm:grid-cols-2">
          <Field label="Title" errors={errs(errors.title?.message)} className="sm:col-span-2">
            <Input {...register('title')} autoComplete="off" placeholder="e.g. Rock-salt test crystal, 4×4×4 cell" data-testid="meta-title" />
          </Field>
          <Field label="Material" errors={errs(errors.material?.message)}>
            <Input {...register('material')} autoComplete="off" data-testid="meta-material" />
          </Field>
          <Field label="Formula" hint="Optional" errors={errs(errors.formula?.message)}>
            <Input {...register('formula')} autoComplete="off" className="font-mono" data-testid="meta-formula" />
          </Field>
          <Field label="Method" hint="e.g. finite displacements, perturbation theory, force field" errors={errs(errors.method?.message)}>
            <Input {...register('method')} autoComplete="off" data-testid="meta-method" />
          </Field>
          <Field label="Code and version" hint="The program and version that produced the file" errors={errs(errors.code?.message)}>
            <Input {...register('code')} autoComplete="off" data-testid="meta-code" />
          </Field>
          <Field label="Supercell" hint="e.g. 4×4×4" errors={errs(errors.supercell?.message)}>
            <Input {...register('supercell')} autoComplete="off" data-testid="meta-supercell" />
          </Field>
          <Field label="q-mesh" hint="e.g. 12×12×12" errors={errs(errors.qmesh?.message)}>
            <Input {...register('qmesh')} autoComplete="off" data-testid="meta-qmesh" />
          </Field>
          <Field label="Notes" hint="Anything a reviewer should know: convergence, settings, doubts" errors={errs(errors.notes?.message)} className="sm:col-span-2">
            <TextArea {...register('notes')} rows={4} data-testid="meta-notes" />
          </Field>
        </fieldset>
      </Panel>

      <div className="flex flex-col gap-5">
        <Panel title="Band file" description="A columns text file or a YAML file; q-points, labels and units are read from the file (docs/formats.md describes both).">
          <div className="flex flex-col gap-3">
            <BandFileDrop file={file} onFile={chooseFile} disabled={busy} error={fileError} />
            {upload.state.file && upload.state.phase !== 'idle' && (
              <UploadProgress name={upload.state.file.name} size={upload.state.file.size} progress={upload.state.progress} phase={upload.state.phase} />
            )}
            <div aria-live="polite">
              {upload.state.phase === 'error' && upload.state.error && (
                <Alert tone="error" title="The upload did not go through" data-testid="upload-error">
                  {upload.state.error}
                </Alert>
              )}
              {upload.state.phase === 'done' && (
                <Alert tone="success" data-testid="upload-done">
                  Uploaded. Opening the spectrum…
                </Alert>
              )}
            </div>
          </div>
        </Panel>
        <div className="flex items-center justify-end gap-2">
          <Link href={`/groups/${group}/spectra`} className={buttonClasses('quiet')}>
            Cancel
          </Link>
          <Button type="submit" disabled={busy} aria-disabled={busy} data-testid="create-spectrum">
            {busy ? 'Uploading…' : 'Upload and screen'}
          </Button>
        </div>
      </div>
    </form>
  );
}
