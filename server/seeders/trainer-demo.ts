import type { Sequelize } from 'sequelize';
import { OrganizationModel, PostModel, TrainerCourseModel, UserModel } from '@/server/data/models';
import { trainerDrillsRepository } from '@/server/data/repositories/trainer-drills-repository';
import type { Actor } from '@/server/domain/actor';
import { recordCalibration } from '@/server/domain/calibrations/manage-calibrations';
import { createCourse, startAttempt } from '@/server/domain/courses/manage-courses';
import { answerDrill } from '@/server/domain/drills/manage-drills';

/**
 * The trainer in the invented demo district: one course on two of its posts
 * assigned to three lookouts (Sami Rookwood failed once then passed, Ines
 * Marrow failed, Bram Tolliver has not started) and two field sightings of k
 * (a dip at Gull Point, reciprocal angles from Crane Knoll Tower). Through the
 * use cases, so every figure is the app's own. Idempotent: runs while the
 * organisation has no course.
 */
export async function seedDemoTraining(db: Sequelize, orgSlug: string): Promise<boolean> {
  const org = await OrganizationModel.findOne({ where: { slug: orgSlug } });
  if (!org || (await TrainerCourseModel.count({ where: { organizationId: org.id } })) > 0) return false;
  const actor = async (email: string): Promise<Actor | null> => {
    const u = await UserModel.findOne({ where: { email, organizationId: org.id } });
    return u ? { userId: u.id, organizationId: org.id, role: u.role } : null;
  };
  const planner = await actor('planner@demo.kenning.test');
  const sami = await actor('observer@demo.kenning.test');
  const ines = await actor('lookout.marrow@demo.kenning.test');
  const bram = await actor('lookout.tolliver@demo.kenning.test');
  const posts = await PostModel.findAll({ where: { organizationId: org.id } });
  const crane = posts.find((p) => p.name === 'Crane Knoll Tower');
  const gull = posts.find((p) => p.name === 'Gull Point');
  if (!planner || !sami || !ines || !bram || !crane || !gull) return false;

  const course = await createCourse({ db }, planner, {
    name: 'Horizon and hidden height, season refresher',
    kinds: ['horizon-distance', 'hidden-height'],
    postIds: [crane.id, gull.id],
    questionCount: 4,
    passMarkPct: 75,
    validityDays: 180,
    units: 'metric',
    assigneeIds: [sami.userId, ines.userId, bram.userId],
  });
  /** One attempt answered at `factor` × the correct value (1: right; 1.1: half credit; 1.4: none). */
  const attempt = async (who: Actor, factors: number[]) => {
    const a = await startAttempt({ db }, who, course.id);
    for (const [i, d] of a.drills.entries()) {
      const solved = await db.transaction((t) => trainerDrillsRepository.solutionOf(org.id, who.userId, d.id, t));
      const correct = solved?.solution.correctValue;
      if (typeof correct !== 'number') continue;
      await answerDrill({ db }, who, d.id, { value: Number((correct * (factors[i] ?? 1)).toFixed(2)) });
    }
  };
  await attempt(sami, [1, 1.1, 1.4, 1]);
  await attempt(sami, [1, 1, 1, 1.02]);
  await attempt(ines, [1.1, 1.4, 1, 1.4]);

  await recordCalibration({ db }, sami, {
    method: 'dip',
    postId: gull.id,
    eyeHeightM: 24,
    observedDipArcmin: 8.2,
    accuracyArcmin: 0.5,
    weather: { pressureHpa: 1016, temperatureC: 14, lapseRateKPerM: 0.004 },
    notes: 'Clear sea horizon to the south-west, calm.',
    saveAsConditionSet: false,
  });
  await recordCalibration({ db }, planner, {
    method: 'reciprocal',
    postId: crane.id,
    distanceM: 8000,
    zenithAngle1Deg: 90.05,
    zenithAngle2Deg: 90.0126,
    accuracyArcsec: 5,
    notes: 'Crane Knoll Tower to the Sedge Ridge survey pillar, both angles at 11:00.',
    saveAsConditionSet: false,
  });
  return true;
}
