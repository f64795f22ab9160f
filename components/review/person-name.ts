import type { PersonDto } from '@/lib/client/spectra-types';

export const personName = (p: PersonDto | null | undefined): string => (p ? p.name || p.email : 'someone no longer here');
