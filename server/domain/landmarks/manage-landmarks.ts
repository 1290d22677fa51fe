import { UniqueConstraintError, type Sequelize } from 'sequelize';
import type { Landmark, LandmarkInput, LandmarkUpdate } from '@/shared/schemas/landmark';
import { auditRepository } from '@/server/data/repositories/audit-repository';
import { landmarksRepository } from '@/server/data/repositories/landmarks-repository';
import { sitesRepository } from '@/server/data/repositories/sites-repository';
import type { Actor } from '@/server/domain/actor';
import { AppError } from '@/server/domain/app-error';

const NOT_FOUND = 'That landmark';
const DUPLICATE = 'This site already has a landmark of that name.';

async function checkSite(actor: Actor, siteId: string) {
  const site = await sitesRepository.findInOrganization(actor.organizationId, siteId);
  if (!site) throw AppError.notFound('That site');
}

/** A duplicate name is a field error, not a 500. */
function duplicateName(error: unknown): never {
  if (error instanceof UniqueConstraintError) throw AppError.conflict(DUPLICATE, 'duplicate_name');
  throw error;
}

/** The site's landmarks, by name. Every role reads. */
export async function listLandmarks(actor: Actor, siteId: string): Promise<{ items: Landmark[] }> {
  await checkSite(actor, siteId);
  return { items: await landmarksRepository.listInSite(actor.organizationId, siteId) };
}

/** Adds a landmark to one of the organisation's sites (planners, as for posts); audited. */
export async function createLandmark({ db }: { db: Sequelize }, actor: Actor, siteId: string, input: LandmarkInput) {
  await checkSite(actor, siteId);
  try {
    return await db.transaction(async (t) => {
      const landmark = await landmarksRepository.create(actor.organizationId, siteId, input, t);
      await auditRepository.record(
        actor,
        { action: 'create', entityType: 'landmark', entityId: landmark.id, after: { name: landmark.name, siteId } },
        t,
      );
      return landmark;
    });
  } catch (error) {
    return duplicateName(error);
  }
}

/** Changes a landmark at the version the planner saw; a stale version is a 409. */
export async function updateLandmark({ db }: { db: Sequelize }, actor: Actor, siteId: string, id: string, input: LandmarkUpdate) {
  const { version, ...changes } = input;
  try {
    return await db.transaction(async (t) => {
      const before = await landmarksRepository.findInSite(actor.organizationId, siteId, id, t);
      if (!before) throw AppError.notFound(NOT_FOUND);
      const after = await landmarksRepository.update(actor.organizationId, siteId, id, version, changes, t);
      if (!after) {
        throw AppError.conflict('Someone else changed this landmark since you loaded it. Reload and try again.', 'stale_version');
      }
      await auditRepository.record(actor, { action: 'update', entityType: 'landmark', entityId: id, before, after }, t);
      return after;
    });
  } catch (error) {
    return duplicateName(error);
  }
}

/** Removes a landmark (reports that used it keep their stored position and name). */
export async function deleteLandmark({ db }: { db: Sequelize }, actor: Actor, siteId: string, id: string) {
  await db.transaction(async (t) => {
    const before = await landmarksRepository.findInSite(actor.organizationId, siteId, id, t);
    if (!before) throw AppError.notFound(NOT_FOUND);
    await landmarksRepository.remove(actor.organizationId, siteId, id, t);
    await auditRepository.record(actor, { action: 'delete', entityType: 'landmark', entityId: id, before }, t);
  });
}
