import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { CalibrationListSchema, CalibrationSchema, type CalibrationInput } from '@/shared/schemas/calibration';
import {
  CourseAttemptSchema,
  CourseResultsSchema,
  CourseSchema,
  QualificationListSchema,
  type CourseInput,
} from '@/shared/schemas/course';
import { DrillResultSchema, DrillSchema, type DrillRequest } from '@/shared/schemas/drill';
import { api } from './api-client';
import { rosterKeys } from './roster';

/*
 * Trainer: courses, attempts, drills, qualifications and field calibrations
 * (`/api/v1/courses…`, `/drills…`, `/qualifications`, `/calibrations…`).
 */

export const trainerKeys = {
  all: ['trainer'] as const,
  courses: () => [...trainerKeys.all, 'courses'] as const,
  course: (id: string) => [...trainerKeys.courses(), id] as const,
  results: (id: string) => [...trainerKeys.course(id), 'results'] as const,
  attempt: (courseId: string, attemptId: string) => [...trainerKeys.course(courseId), 'attempt', attemptId] as const,
  qualifications: (userId?: string) => [...trainerKeys.all, 'qualifications', userId ?? 'all'] as const,
  calibrations: () => [...trainerKeys.all, 'calibrations'] as const,
};

const CourseListSchema = z.object({ items: z.array(CourseSchema) });
const CourseBody = z.object({ course: CourseSchema });
const AttemptBody = z.object({ attempt: CourseAttemptSchema });

export const coursesQuery = () =>
  queryOptions({ queryKey: trainerKeys.courses(), queryFn: async () => (await api.get('/v1/courses', CourseListSchema)).items });

export const courseResultsQuery = (id: string) =>
  queryOptions({ queryKey: trainerKeys.results(id), queryFn: () => api.get(`/v1/courses/${id}/results`, CourseResultsSchema) });

export const attemptQuery = (courseId: string, attemptId: string) =>
  queryOptions({
    queryKey: trainerKeys.attempt(courseId, attemptId),
    queryFn: async () => (await api.get(`/v1/courses/${courseId}/attempts/${attemptId}`, AttemptBody)).attempt,
  });

/** Qualifications of one person (observers: always themselves) or, without a person, of everyone the caller may see. */
export const qualificationsQuery = (userId?: string) =>
  queryOptions({
    queryKey: trainerKeys.qualifications(userId),
    queryFn: async () =>
      (await api.get(`/v1/qualifications${userId ? `?${new URLSearchParams({ userId })}` : ''}`, QualificationListSchema)).items,
  });

export const calibrationsQuery = () =>
  queryOptions({
    queryKey: trainerKeys.calibrations(),
    queryFn: () => api.get('/v1/calibrations?pageSize=20', CalibrationListSchema),
  });

export const useCourses = () => useQuery(coursesQuery());
export const useCourseResults = (id: string) => useQuery(courseResultsQuery(id));
export const useAttempt = (courseId: string, attemptId: string) =>
  // An attempt's questions are fixed once started: keep them for the phone that goes offline.
  useQuery({ ...attemptQuery(courseId, attemptId), staleTime: Infinity, gcTime: Infinity });
export const useQualifications = (userId?: string, enabled = true) => useQuery({ ...qualificationsQuery(userId), enabled });
export const useCalibrations = () => useQuery(calibrationsQuery());

export function useCreateCourse() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CourseInput) => api.post('/v1/courses', input, CourseBody),
    onSuccess: () => qc.invalidateQueries({ queryKey: trainerKeys.all }),
  });
}

export function useAssignCourse() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, userIds }: { id: string; userIds: string[] }) =>
      api.post(`/v1/courses/${id}/assignees`, { userIds }, CourseBody),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: trainerKeys.all });
      await qc.invalidateQueries({ queryKey: rosterKeys.all });
    },
  });
}

export function useStartAttempt() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (courseId: string) => (await api.post(`/v1/courses/${courseId}/attempts`, {}, AttemptBody)).attempt,
    onSuccess: (attempt) => qc.setQueryData(trainerKeys.attempt(attempt.courseId, attempt.id), attempt),
  });
}

export function useCreateDrill() {
  return useMutation({
    mutationFn: async (request: Partial<DrillRequest> & Pick<DrillRequest, 'kind'>) =>
      (await api.post('/v1/drills', request, z.object({ drill: DrillSchema }))).drill,
  });
}

/** One drill as it stands (its result once answered). */
export const getDrill = async (id: string) => (await api.get(`/v1/drills/${id}`, z.object({ drill: DrillSchema }))).drill;

/** Sends one answer; the caller keeps it in the device's outbox when the network is out. */
export const answerDrill = (drillId: string, value: number | boolean) =>
  api.post(`/v1/drills/${drillId}/answer`, { value }, DrillResultSchema);

export function useRecordCalibration() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CalibrationInput) =>
      api.post('/v1/calibrations', input, z.object({ calibration: CalibrationSchema, conditionSet: z.unknown().optional() })),
    onSuccess: () => qc.invalidateQueries({ queryKey: trainerKeys.calibrations() }),
  });
}

export function useSaveCalibrationAsConditionSet() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post(`/v1/calibrations/${id}/condition-set`, {}, z.unknown()),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: trainerKeys.calibrations() });
      await qc.invalidateQueries({ queryKey: ['library'] });
    },
  });
}
