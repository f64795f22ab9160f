'use client';

/** The upload SDK's React helpers, typed with our file router (a type-only import). */
import { generateReactHelpers } from '@uploadthing/react';
import type { UploadRouter } from '@/app/api/uploadthing/core';

export const { useUploadThing } = generateReactHelpers<UploadRouter>({ url: '/api/uploadthing' });
