import { Op, type Transaction } from 'sequelize';
import type { Drill, DrillKind, DrillQuestion, DrillUnits } from '@/shared/schemas/drill';
import type { GeneratedDrill } from '@/shared/trainer/generate-drill';
import { TrainerDrillModel } from '../models';

const toDrill = (r: TrainerDrillModel): Drill => ({
  id: r.id,
  kind: r.kind,
  seed: r.seed,
  units: r.units,
  postId: r.postId,
  question: r.question,
  scoring: r.solution.explanation.scoring,
  createdAt: r.createdAt.toISOString(),
  result:
    r.answeredAt && r.answer && r.score !== null
      ? {
          value: r.answer.value,
          correctValue: r.solution.correctValue,
          score: r.score,
          explanation: r.solution.explanation,
          answeredAt: r.answeredAt.toISOString(),
        }
      : null,
});

/** What a new drill row holds. */
export interface NewDrill {
  userId: string;
  postId: string | null;
  kind: DrillKind;
  seed: number;
  units: DrillUnits;
  question: DrillQuestion;
  solution: GeneratedDrill['solution'];
  attemptId?: string | null;
  position?: number | null;
}

/** Drills of one organisation, each one person's, as plain objects (the solution only once answered). */
export const trainerDrillsRepository = {
  async create(organizationId: string, input: NewDrill, transaction: Transaction): Promise<Drill> {
    return toDrill(await TrainerDrillModel.create({ ...input, organizationId }, { transaction }));
  },

  /** The person's own drill; null for anyone else's (or another organisation's). */
  async findOwn(organizationId: string, userId: string, id: string, transaction?: Transaction): Promise<Drill | null> {
    const row = await TrainerDrillModel.findOne({ where: { id, organizationId, userId }, transaction });
    return row ? toDrill(row) : null;
  },

  /** The solution of the person's own drill, for scoring. */
  async solutionOf(
    organizationId: string,
    userId: string,
    id: string,
    transaction: Transaction,
  ): Promise<{
    question: DrillQuestion;
    solution: GeneratedDrill['solution'];
    answered: { value: number | boolean; score: number } | null;
    attemptId: string | null;
  } | null> {
    const row = await TrainerDrillModel.findOne({ where: { id, organizationId, userId }, transaction });
    if (!row) return null;
    const answered = row.answeredAt && row.answer && row.score !== null ? { value: row.answer.value, score: row.score } : null;
    return { question: row.question, solution: row.solution, answered, attemptId: row.attemptId ?? null };
  },

  /** The drills of one attempt, in order. */
  async ofAttempt(organizationId: string, attemptId: string, transaction?: Transaction): Promise<Drill[]> {
    const rows = await TrainerDrillModel.findAll({
      where: { organizationId, attemptId },
      order: [['position', 'ASC']],
      transaction,
    });
    return rows.map(toDrill);
  },

  /** Every answered drill of these attempts: kind and score, for results by kind. */
  async scoresOfAttempts(
    organizationId: string,
    attemptIds: string[],
  ): Promise<{ attemptId: string; kind: DrillKind; score: number }[]> {
    if (attemptIds.length === 0) return [];
    const rows = await TrainerDrillModel.findAll({
      where: { organizationId, attemptId: { [Op.in]: attemptIds }, answeredAt: { [Op.not]: null } },
      attributes: ['attemptId', 'kind', 'score'],
    });
    return rows.map((r) => ({ attemptId: r.attemptId!, kind: r.kind, score: r.score ?? 0 }));
  },

  /**
   * Stores the answer only if the drill has none yet: one conditional UPDATE, so two answers sent at once
   * cannot both land. False when it was already answered.
   */
  async answerOnce(
    organizationId: string,
    userId: string,
    id: string,
    answer: { value: number | boolean },
    score: number,
    transaction: Transaction,
  ): Promise<boolean> {
    const [count] = await TrainerDrillModel.update(
      { answer, score, answeredAt: new Date() },
      { where: { id, organizationId, userId, answeredAt: { [Op.is]: null } }, transaction },
    );
    return count === 1;
  },
};
