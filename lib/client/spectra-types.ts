/**
 * The spectra API's shapes as the browser sees them. Types come from the server's DTOs
 * (type-only imports: nothing of the server reaches the bundle); the value lists are repeated
 * here because the entity modules that hold them load the ORM, and `satisfies` keeps the two
 * in step at compile time.
 */
import type { SpectrumStatus, VerdictValue, ScreeningStatus } from '@/entities';
import type { SortKey, SpectrumDetail, SpectrumListItem, RevisionDto, FindingCounts, PersonDto } from '@/lib/services/spectra';
import type { ScreeningDto, StoredFindingDto } from '@/lib/services/screening-results';

export type { SpectrumStatus, VerdictValue, ScreeningStatus, SortKey, SpectrumDetail, SpectrumListItem, RevisionDto, FindingCounts, PersonDto };
export type { ScreeningDto, StoredFindingDto };

export type SpectraPage = { items: SpectrumListItem[]; total: number };

export const SPECTRUM_STATUSES = ['screening', 'in-review', 'returned', 'approved', 'rejected', 'withdrawn'] as const satisfies readonly SpectrumStatus[];
export const VERDICTS = ['pass', 'warn', 'fail'] as const satisfies readonly VerdictValue[];
/** `none`: not screened yet, or the file did not parse. */
export type VerdictFilter = VerdictValue | 'none';
export const VERDICT_FILTERS = [...VERDICTS, 'none'] as const satisfies readonly VerdictFilter[];
export const SCREENING_STATUSES = ['pending', 'done', 'error'] as const satisfies readonly ScreeningStatus[];
export const SORT_KEYS = ['updated', 'created', 'title', 'material', 'status', 'verdict'] as const satisfies readonly SortKey[];

// The reverse direction: a status the server adds without us fails the build here.
type Missing<All, Listed> = Exclude<All, Listed> extends never ? true : never;
const statusesComplete: Missing<SpectrumStatus, (typeof SPECTRUM_STATUSES)[number]> = true;
const sortKeysComplete: Missing<SortKey, (typeof SORT_KEYS)[number]> = true;
const screeningComplete: Missing<ScreeningStatus, (typeof SCREENING_STATUSES)[number]> = true;
void screeningComplete;
void statusesComplete;
void sortKeysComplete;
