import { ApiToken } from './api-token';
import { AuditEvent } from './audit-event';
import { Group } from './group';
import { Invitation } from './invitation';
import { Membership } from './membership';
import { User } from './user';
import { VerificationToken } from './verification-token';

export { ApiToken, AuditEvent, Group, Invitation, Membership, User, VerificationToken };
export { roles, type Role } from './common';

/** Every entity, listed explicitly for MikroORM. Add new entities here. */
export const allEntities = [User, Group, Membership, Invitation, AuditEvent, ApiToken, VerificationToken];
