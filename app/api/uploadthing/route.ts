import { createRouteHandler } from 'uploadthing/next';
import { uploadRouter } from './core';

export const dynamic = 'force-dynamic';

// Token, ingest and callback URLs come from the environment (scripts/env.sh).
export const { GET, POST } = createRouteHandler({ router: uploadRouter, config: { logLevel: 'Error' } });
