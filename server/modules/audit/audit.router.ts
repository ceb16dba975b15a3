/** /api/benches/:benchId/audit. Mounted behind requireUser and loadBenchAccess (app.ts). Owners only. */
import { Router } from 'express';
import { AuditListQuery, type AuditListResponse } from '../../contracts/audit';
import { forbidden } from '../../errors';
import { benchAccessOf } from '../../middleware/bench-access';
import { AUDIT_OWNERS_ONLY_MESSAGE, type AuditService } from './audit.service';

export function auditRouter(audit: AuditService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', async (req, res) => {
    const access = benchAccessOf(res);
    if (access.role !== 'owner') throw forbidden(AUDIT_OWNERS_ONLY_MESSAGE);
    const query = AuditListQuery.parse(req.query);
    res.json((await audit.list(access, query)) satisfies AuditListResponse);
  });

  return router;
}
