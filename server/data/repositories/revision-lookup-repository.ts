import { QueryTypes } from 'sequelize';
import type { PlanStatus } from '@/shared/schemas/plan';
import { PlanModel } from '../models';

/** Finding plan revisions by their content hash, and the versions that followed a plan. */
export const revisionLookupRepository = {
  /** Revisions of the organisation's plans whose content hash is `sha256` (lower-case hex), newest first. */
  async byContentHash(organizationId: string, sha256: string): Promise<{ planId: string; number: number }[]> {
    return PlanModel.sequelize!.query<{ planId: string; number: number }>(
      `SELECT r.plan_id AS "planId", r.number
         FROM plan_revisions r JOIN plans p ON p.id = r.plan_id
        WHERE r.content_hash = :sha256 AND p.organization_id = :organizationId
        ORDER BY r.created_at DESC`,
      { replacements: { sha256, organizationId }, type: QueryTypes.SELECT },
    );
  },

  /** The organisation's plans that are new versions of `planId` (its direct successors). */
  async successors(organizationId: string, planId: string): Promise<{ id: string; status: PlanStatus }[]> {
    const rows = await PlanModel.findAll({
      where: { organizationId, previousId: planId },
      attributes: ['id', 'status'],
      order: [['version', 'ASC']],
      raw: true,
    });
    return rows.map((r) => ({ id: r.id, status: r.status }));
  },
};
