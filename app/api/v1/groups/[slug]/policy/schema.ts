import { z } from 'zod';
import { reviewPolicyInput } from '@/lib/review/review-policy';

export const policyParams = z.object({ slug: z.string() });

/** Any subset: required approvals, blocking severities, and the thresholds that change. */
export const policyBody = reviewPolicyInput;
