import { route } from '@/lib/http/route';
import type { AuditEventDto } from '@/lib/services/audit';
import { spectrumAudit } from '@/lib/services/review-audit';
import { spectrumAuditParams } from './schema';

export const dynamic = 'force-dynamic';

export type SpectrumAuditResponse = { items: AuditEventDto[] };

/** The spectrum's audit trail, oldest first (admins). */
export const GET = route({ params: spectrumAuditParams }, async ({ em, caller, params }): Promise<SpectrumAuditResponse> =>
  spectrumAudit(em, caller, params.id),
);
