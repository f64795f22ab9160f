/**
 * The review API's shapes as the browser sees them: type-only imports of the routes' exported
 * response types, so nothing of the server reaches the bundle.
 */
export type { ThreadDto, ThreadAnchorDto, ReplyDto, MovedDto } from '@/lib/services/threads';
export type { DecisionDto, ReopenDto, ReviewStateDto } from '@/lib/services/decisions';
export type { WaiverDto } from '@/lib/services/waivers';
export type { ReviewersDto } from '@/lib/services/reviewers';
export type { PolicyDto } from '@/lib/services/policy';
export type { AuditEventDto } from '@/lib/services/audit';
export type { ComparisonDto } from '@/lib/services/compare';
export type { ApprovalState } from '@/lib/review/approval';
export type { WaiveResponse } from '@/app/api/v1/findings/[id]/waiver/route';
export type { WaiveManyResponse } from '@/app/api/v1/revisions/[id]/waivers/route';
export type { UpdateThreadResponse } from '@/app/api/v1/threads/[id]/route';
export type { DecisionsResponse, DecideResponse } from '@/app/api/v1/spectra/[id]/decisions/route';
export type { GroupAuditResponse } from '@/app/api/v1/groups/[slug]/audit/route';
export type { DerivedResponse } from '@/app/api/v1/revisions/[id]/derived/route';
export type { MembersResponse } from '@/app/api/v1/groups/[slug]/members/route';

export type DecisionVerdict = 'approve' | 'return' | 'reject';

/** A point anchor as the composer sends it. */
export interface PointAnchor {
  revision: string;
  index: number;
  branch: number;
}
