/**
 * What went wrong with an upload, in plain words. The upload route refuses with our own
 * sentences (who may upload, which files); the SDK's own codes get a sentence here.
 */
export interface UploadErrorLike {
  code?: string;
  message?: string;
}

// Messages the SDK makes up itself: they say nothing a person can act on.
const GENERIC = [/^something went wrong/i, /^failed to run middleware/i, /^upload failed$/i, /^unknown error/i, /^internal/i];

const byCode: Record<string, string> = {
  FORBIDDEN: 'You are not allowed to upload here. Ask the group admin if you need the submitter role.',
  NOT_FOUND: 'That group or spectrum was not found. It may have been removed; reload the page.',
  TOO_LARGE: 'The file is larger than 64 MiB, the limit for a band file.',
  TOO_SMALL: 'The file is empty.',
  TOO_MANY_FILES: 'Upload one band file at a time.',
  FILE_LIMIT_EXCEEDED: 'Upload one band file at a time.',
  BAD_REQUEST: 'The upload was refused: check the form and the file.',
  UPLOAD_FAILED: 'The file did not reach storage. Check your connection and try again.',
  URL_GENERATION_FAILED: 'The upload could not be started. Try again in a moment.',
  INTERNAL_CLIENT_ERROR: 'The upload stopped in the browser. Reload the page and try again.',
  INTERNAL_SERVER_ERROR: 'Something went wrong on our side while receiving the file. Try again in a moment.',
};

export function uploadErrorText(e: UploadErrorLike | null | undefined): string {
  const message = e?.message?.trim();
  if (message && !GENERIC.some((re) => re.test(message))) return message;
  return (e?.code && byCode[e.code]) || 'The upload did not complete. Try again; if it keeps failing, tell the group admin.';
}
