import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { MeUpdate, SignInRequest, User } from '@/shared/schemas/auth';
import type { LengthUnit } from '@/shared/units/length';
import { UNIT_SYSTEMS, unitSystemFor, type UnitSystem } from '@/shared/units/unit-systems';
import { forgetDeviceCopies } from '@/components/offline/persisted-cache';
import { resetLanding } from './first-landing';
import { api, ApiRequestError, lazySchema, NetworkError } from './api-client';
import { loadFirstScreenSchemas } from './deferred-chunk';
import { STALE } from './query-client';

const MeResponseSchema = lazySchema(() => loadFirstScreenSchemas().then((m) => m.MeResponseSchema));

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
};

/** The signed-in user, or null when signed out (401 is an answer, not an error). */
export const meQuery = () =>
  queryOptions({
    queryKey: sessionKeys.me(),
    staleTime: STALE.session,
    queryFn: async (): Promise<User | null> => {
      // A sign-out made with no network ends the server's session at the first contact, before anything else.
      if (signOutPending()) {
        await api.post('/auth/sign-out', {}, null);
        setSignOutPending(false);
        return null;
      }
      try {
        return (await api.get('/me', MeResponseSchema)).user;
      } catch (e) {
        if (e instanceof ApiRequestError && e.status === 401) return null;
        throw e;
      }
    },
  });

export function useSession() {
  return useQuery(meQuery());
}

/** Drops every cached query that belonged to the previous user, keeping the session query observed. */
function forgetOtherUsersData(qc: ReturnType<typeof useQueryClient>) {
  resetLanding();
  qc.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
  // The device's own copies go too: the kept query cache and the outbox (field mode).
  void forgetDeviceCopies();
}

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInRequest) => api.post('/auth/sign-in', input, MeResponseSchema),
    onSuccess: ({ user }) => {
      setSignOutPending(false);
      forgetOtherUsersData(qc);
      qc.setQueryData(sessionKeys.me(), user);
    },
  });
}

/**
 * A sign-out the server has not heard yet (made in the field with no network).
 * Kept in the browser's storage so a restart still finishes it.
 */
const SIGN_OUT_PENDING = 'kenning.signOutPending';
const storage = () => (typeof localStorage === 'undefined' ? null : localStorage);
const signOutPending = () => storage()?.getItem(SIGN_OUT_PENDING) === '1';
function setSignOutPending(pending: boolean) {
  if (pending) storage()?.setItem(SIGN_OUT_PENDING, '1');
  else storage()?.removeItem(SIGN_OUT_PENDING);
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    // Offline the device forgets the person at once; the server's session ends when the network is back.
    networkMode: 'always',
    mutationFn: async () => {
      try {
        await api.post('/auth/sign-out', {}, null);
      } catch (e) {
        if (!(e instanceof NetworkError)) throw e;
        setSignOutPending(true);
      }
    },
    onSettled: () => {
      forgetOtherUsersData(qc);
      qc.setQueryData(sessionKeys.me(), null);
    },
  });
}

/** Ends every session of this account on the server (other browsers and phones too), then this one. */
export function useSignOutEverywhere() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post('/auth/sign-out-everywhere', {}, null),
    onSuccess: () => {
      forgetOtherUsersData(qc);
      qc.setQueryData(sessionKeys.me(), null);
    },
  });
}

export function useSetPassword() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) => api.post('/auth/set-password', input, null),
  });
}

/** Saves the person's own settings (their unit system; null = each site's default). */
export function useUpdateMe() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: MeUpdate) => api.patch('/me', input, MeResponseSchema),
    onSuccess: ({ user }) => qc.setQueryData(sessionKeys.me(), user),
  });
}

/**
 * The unit system a person sees: their own choice (account page), else the
 * site's default units, else metric.
 */
export function useUnitSystem(siteDefault?: UnitSystem | null): UnitSystem {
  const { data: user } = useSession();
  return unitSystemFor(user?.unitPreference, siteDefault);
}

/** The length units a person reads heights and distances in (see {@link useUnitSystem}). */
export function useLengthUnits(siteDefault?: UnitSystem | null): {
  height: LengthUnit;
  distance: LengthUnit;
  system: UnitSystem;
} {
  const system = useUnitSystem(siteDefault);
  return { height: UNIT_SYSTEMS[system].height, distance: UNIT_SYSTEMS[system].distance, system };
}
