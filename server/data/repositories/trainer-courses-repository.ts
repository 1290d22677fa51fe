import { Op, type Transaction } from 'sequelize';
import type { Course, CourseInput } from '@/shared/schemas/course';
import {
  TrainerCourseAssigneeModel,
  TrainerCourseAttemptModel,
  TrainerCourseModel,
  TrainerDrillModel,
  UserModel,
} from '../models';

/** An attempt's row as plain data (drills apart). */
export interface AttemptRow {
  id: string;
  courseId: string;
  userId: string;
  seed: number;
  questionCount: number;
  passMarkPct: number;
  startedAt: string;
  completedAt: string | null;
  scorePct: number | null;
  passed: boolean | null;
}

const toAttempt = (r: TrainerCourseAttemptModel): AttemptRow => ({
  id: r.id,
  courseId: r.courseId,
  userId: r.userId,
  seed: r.seed,
  questionCount: r.questionCount,
  passMarkPct: r.passMarkPct,
  startedAt: r.createdAt.toISOString(),
  completedAt: r.completedAt ? r.completedAt.toISOString() : null,
  scorePct: r.scorePct ?? null,
  passed: r.passed ?? null,
});

async function namesOf(ids: string[], transaction?: Transaction): Promise<Map<string, string>> {
  if (ids.length === 0) return new Map();
  const rows = await UserModel.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'name'], transaction });
  return new Map(rows.map((u) => [u.id, u.name]));
}

async function toCourses(rows: TrainerCourseModel[], transaction?: Transaction): Promise<Course[]> {
  if (rows.length === 0) return [];
  const assignees = await TrainerCourseAssigneeModel.findAll({
    where: { courseId: { [Op.in]: rows.map((r) => r.id) } },
    transaction,
  });
  const names = await namesOf([...new Set([...rows.map((r) => r.createdById), ...assignees.map((a) => a.userId)])], transaction);
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    kinds: r.kinds,
    postIds: r.postIds,
    questionCount: r.questionCount,
    passMarkPct: r.passMarkPct,
    validityDays: r.validityDays,
    units: r.units,
    createdBy: { id: r.createdById, name: names.get(r.createdById) ?? '' },
    assignees: assignees
      .filter((a) => a.courseId === r.id)
      .map((a) => ({ id: a.userId, name: names.get(a.userId) ?? '' }))
      .sort((a, b) => a.name.localeCompare(b.name, 'en')),
    version: r.version,
    createdAt: r.createdAt.toISOString(),
  }));
}

/** Courses, their assignees and attempts, of one organisation, as plain objects. */
export const trainerCoursesRepository = {
  async create(
    organizationId: string,
    input: Omit<CourseInput, 'assigneeIds'> & { createdById: string },
    transaction: Transaction,
  ): Promise<string> {
    return (await TrainerCourseModel.create({ ...input, organizationId }, { transaction })).id;
  },

  async find(organizationId: string, id: string, transaction?: Transaction): Promise<Course | null> {
    const row = await TrainerCourseModel.findOne({ where: { id, organizationId }, transaction });
    return row ? ((await toCourses([row], transaction))[0] ?? null) : null;
  },

  /** Every course of the organisation, or only those assigned to `assignedTo`; newest first. */
  async list(organizationId: string, assignedTo?: string): Promise<Course[]> {
    const ids = assignedTo
      ? (
          await TrainerCourseAssigneeModel.findAll({ where: { organizationId, userId: assignedTo }, attributes: ['courseId'] })
        ).map((a) => a.courseId)
      : null;
    const rows = await TrainerCourseModel.findAll({
      where: { organizationId, ...(ids && { id: { [Op.in]: ids } }) },
      order: [
        ['createdAt', 'DESC'],
        ['id', 'ASC'],
      ],
    });
    return toCourses(rows);
  },

  /** Of these user ids, those that are active people of the organisation. */
  async activePeople(organizationId: string, ids: string[], transaction?: Transaction): Promise<Set<string>> {
    if (ids.length === 0) return new Set();
    const rows = await UserModel.findAll({
      where: { organizationId, active: true, id: { [Op.in]: ids } },
      attributes: ['id'],
      transaction,
    });
    return new Set(rows.map((u) => u.id));
  },

  /** Assigns people (those already assigned stay as they are). */
  async assign(organizationId: string, courseId: string, userIds: string[], assignedById: string, transaction: Transaction) {
    await TrainerCourseAssigneeModel.bulkCreate(
      userIds.map((userId) => ({ organizationId, courseId, userId, assignedById })),
      { ignoreDuplicates: true, transaction },
    );
  },

  async isAssigned(organizationId: string, courseId: string, userId: string, transaction?: Transaction): Promise<boolean> {
    return (await TrainerCourseAssigneeModel.count({ where: { organizationId, courseId, userId }, transaction })) > 0;
  },

  async createAttempt(
    organizationId: string,
    input: { courseId: string; userId: string; seed: number; questionCount: number; passMarkPct: number },
    transaction: Transaction,
  ): Promise<AttemptRow> {
    return toAttempt(await TrainerCourseAttemptModel.create({ ...input, organizationId }, { transaction }));
  },

  async findAttempt(organizationId: string, id: string, transaction?: Transaction): Promise<AttemptRow | null> {
    const row = await TrainerCourseAttemptModel.findOne({ where: { id, organizationId }, transaction });
    return row ? toAttempt(row) : null;
  },

  /** A course's attempts (of one person, or everyone's), oldest first. */
  async attempts(organizationId: string, courseId: string, userId?: string): Promise<AttemptRow[]> {
    const rows = await TrainerCourseAttemptModel.findAll({
      where: { organizationId, courseId, ...(userId && { userId }) },
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
    return rows.map(toAttempt);
  },

  /**
   * Scores the attempt once every drill is answered: the mean score, passed when it reaches the pass mark.
   * One conditional update (`completed_at IS NULL`), so it is scored once. Returns the attempt as it stands.
   */
  async completeIfAnswered(organizationId: string, attemptId: string, transaction: Transaction): Promise<AttemptRow | null> {
    // The attempt's row is locked first, so two of its drills answered at the same instant are counted together.
    const locked = await TrainerCourseAttemptModel.findOne({
      where: { id: attemptId, organizationId },
      lock: transaction.LOCK.UPDATE,
      transaction,
    });
    const attempt = locked ? toAttempt(locked) : null;
    if (!attempt || attempt.completedAt) return attempt;
    const drills = await TrainerDrillModel.findAll({
      where: { organizationId, attemptId },
      attributes: ['score', 'answeredAt'],
      transaction,
    });
    const answered = drills.filter((d) => d.answeredAt !== null);
    if (answered.length < attempt.questionCount) return attempt;
    const scorePct = (100 * answered.reduce((sum, d) => sum + (d.score ?? 0), 0)) / attempt.questionCount;
    await TrainerCourseAttemptModel.update(
      { completedAt: new Date(), scorePct, passed: scorePct >= attempt.passMarkPct - 1e-9 },
      { where: { id: attemptId, organizationId, completedAt: { [Op.is]: null } }, transaction },
    );
    return this.findAttempt(organizationId, attemptId, transaction);
  },
};
