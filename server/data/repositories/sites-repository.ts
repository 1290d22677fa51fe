import type { SiteSummary } from '@/shared/schemas/site';
import { SiteModel } from '../models';

const toSummary = (row: SiteModel): SiteSummary => ({
  id: row.id,
  name: row.name,
  kind: row.kind,
  notes: row.notes,
  updatedAt: row.updatedAt.toISOString(),
});

export const sitesRepository = {
  async pageInOrganization(organizationId: string, page: number, pageSize: number) {
    const { rows, count } = await SiteModel.findAndCountAll({
      where: { organizationId },
      order: [['name', 'ASC']],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    return { items: rows.map(toSummary), total: count, page, pageSize };
  },
};
