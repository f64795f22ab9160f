import { ApiToken } from './api-token';
import { AuditEvent } from './audit-event';
import { Group } from './group';
import { Invitation } from './invitation';
import { Finding } from './finding';
import { Membership } from './membership';
import { Revision } from './revision';
import { Spectrum } from './spectrum';
import { StoredDispersion } from './stored-dispersion';
import { User } from './user';
import { Decision } from './decision';
import { GroupPolicy } from './group-policy';
import { OutboxMessage } from './outbox-message';
import { Reply } from './reply';
import { Thread } from './thread';
import { Waiver } from './waiver';
import { VerificationToken } from './verification-token';
import { SignInLinkRequest } from './sign-in-link-request';
import { NotificationDelivery } from './notification-delivery';
import { NotificationPreference } from './notification-preference';

export { ApiToken, AuditEvent, Group, Invitation, Membership, User, VerificationToken, SignInLinkRequest };
export { Spectrum, Revision, StoredDispersion, Finding };
export { Thread, Reply, Decision, Waiver, GroupPolicy, OutboxMessage };
export { NotificationPreference, NotificationDelivery };
export { threadAnchorKinds, type ThreadAnchorKind } from './thread';
export { decisionVerdicts, type DecisionVerdictValue } from './decision';
export { spectrumStatuses, verdicts, type SpectrumStatus, type VerdictValue } from './spectrum';
export { screeningStatuses, type ScreeningStatus, type ScreeningErrorInfo, type ScreeningSummary } from './revision';
export type { StoredDispersionMeta } from './stored-dispersion';
export { newId, roles, type Role } from './common';

/** Every entity, listed explicitly for MikroORM. Add new entities here. */
export const allEntities = [User, Group, Membership, Invitation, AuditEvent, ApiToken, VerificationToken, SignInLinkRequest,
  Spectrum, Revision, StoredDispersion, Finding,
  Thread, Reply, Decision, Waiver, GroupPolicy, OutboxMessage,
  NotificationPreference, NotificationDelivery];
