import { Router } from 'express';
import { AuditEventQuerySchema } from '@/shared/schemas/audit';
import { readAuditEvents } from '@/server/domain/audit/read-audit-events';
import { actorOf, requireRole, requireUser } from '@/server/http/session';
import { parseOrThrow } from '@/server/http/validate';

/** The audit trail: administrators and reviewers read their organisation's. */
export function auditRoutes() {
  const router = Router();
  router.get('/audit-events', requireUser, requireRole('admin', 'reviewer'), async (req, res) => {
    res.json(await readAuditEvents(actorOf(req), parseOrThrow(AuditEventQuerySchema, req.query, 'query')));
  });
  return router;
}
