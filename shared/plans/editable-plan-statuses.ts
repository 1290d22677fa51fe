import type { PlanStatus } from '@/shared/schemas/plan';

/**
 * The statuses in which a plan can still change (its fields, posts, files and
 * coverage runs): a draft, or a plan the reviewer returned. Submitted, approved
 * and superseded plans are frozen.
 */
export const EDITABLE_PLAN_STATUSES: readonly PlanStatus[] = Object.freeze(['draft', 'returned']);

/**
 * Whether a plan in `status` can still change.
 *
 * @example
 * isEditablePlanStatus('returned'); // true
 * isEditablePlanStatus('submitted'); // false
 */
export const isEditablePlanStatus = (status: PlanStatus): boolean => EDITABLE_PLAN_STATUSES.includes(status);
