import { describe, expect, it } from 'vitest';
import { uploadErrorText } from './upload-error-text';

describe('uploadErrorText', () => {
  it('keeps the route\'s own sentence', () => {
    expect(uploadErrorText({ code: 'FORBIDDEN', message: 'Your role (observer) does not allow spectrum.create.' })).toBe(
      'Your role (observer) does not allow spectrum.create.',
    );
  });
  it('replaces the SDK\'s generic words by a sentence for the code', () => {
    expect(uploadErrorText({ code: 'UPLOAD_FAILED', message: 'Upload failed' })).toMatch(/did not reach storage/);
    expect(uploadErrorText({ code: 'INTERNAL_SERVER_ERROR', message: 'Failed to run middleware' })).toMatch(/on our side/);
  });
  it('still says something when it knows nothing', () => {
    expect(uploadErrorText(null)).toMatch(/did not complete/);
  });
});
