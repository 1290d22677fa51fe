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
  ): Promise<{ question: DrillQuestion; solution: GeneratedDrill['solution']; answered: boolean } | null> {
    const row = await TrainerDrillModel.findOne({ where: { id, organizationId, userId }, transaction });
    return row ? { question: row.question, solution: row.solution, answered: row.answeredAt !== null } : null;
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
