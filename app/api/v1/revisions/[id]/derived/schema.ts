import { z } from 'zod';

/** Any string: an id that is not a uuid is a 404 like an unknown one. */
export const derivedParams = z.object({ id: z.string() });
