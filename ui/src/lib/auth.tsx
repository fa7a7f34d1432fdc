import { useSyncExternalStore, type ReactNode } from 'react';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { clearSessionToken, getSessionToken, setSessionToken, subscribeToSessionToken } from '@/lib/session-token';
import { paths } from '@/config/paths';
import { authKeys } from '@/lib/query-keys';

import { isAllowed, type LoginRequest, type LoginResponse, type MeResponse, type Role } from '@beamwright/link-core/contracts';

export type { Role } from '@beamwright/link-core/contracts';
export type SignInInput = LoginRequest;
export type SignInResponse = LoginResponse;
export type CurrentUser = MeResponse;

/** What each role may do in the UI, read from the rule table the api enforces (link-core contracts). */
export const policies = {
  canEditDesigns: (role: Role | undefined) => isAllowed(role, 'link.revise'),
  canReview: (role: Role | undefined) => isAllowed(role, 'review.approve'),
};

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  engineer: 'Link engineer',
  reviewer: 'Reviewer',
  installer: 'Installer',
};

export function useSessionToken(): string | null {
  return useSyncExternalStore(subscribeToSessionToken, getSessionToken, () => null);
}

export const getCurrentUser = ({ signal }: { signal?: AbortSignal } = {}) => api.get<CurrentUser>('/auth/me', { signal });

export const getCurrentUserQueryOptions = () =>
  queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => getCurrentUser({ signal }), staleTime: 5 * 60_000 });

/** The signed-in user; only call below <RequireSession>, which waits for it. */
export function useCurrentUser() {
  const token = useSessionToken();
  return useQuery({ ...getCurrentUserQueryOptions(), enabled: token !== null });
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => api.post<SignInResponse>('/auth/login', input, { authenticated: false }),
    onSuccess: (response) => {
      queryClient.clear();
      setSessionToken(response.accessToken, response.expiresInS);
    },
  });
}

/** Ends the session on the server too, so the token is refused even if a copy of it survives. */
export const signOutOnServer = () => api.post<void>('/auth/logout', undefined, { dropSessionOn401: false });

export function useSignOut() {
  const queryClient = useQueryClient();
  return () => {
    // Best effort: the request takes the token now, and the local state goes whatever it answers
    // (offline, or a session that had already ended).
    signOutOnServer().catch(() => undefined);
    clearSessionToken();
    // Nothing fetched or typed by one user may be shown to the next in this tab.
    queryClient.clear();
    for (const key of Object.keys(window.sessionStorage)) {
      if (key.startsWith('beamwright.draft.')) window.sessionStorage.removeItem(key);
    }
  };
}

/**
 * Route guard: without a session the user goes to the sign-in page (coming back here afterwards);
 * with one, the children render once the user's profile has loaded. The api client clears the
 * token on any 401, which re-renders this guard into the redirect.
 */
export function RequireSession({ children, fallback }: { children?: ReactNode; fallback?: ReactNode }) {
  const token = useSessionToken();
  const location = useLocation();
  const currentUser = useCurrentUser();

  if (token === null) {
    return <Navigate to={paths.signIn.getHref(`${location.pathname}${location.search}`)} replace />;
  }
  if (currentUser.isPending) return <>{fallback ?? null}</>;
  if (currentUser.isError) {
    if (isApiError(currentUser.error, 401)) {
      return <Navigate to={paths.signIn.getHref(`${location.pathname}${location.search}`)} replace />;
    }
    throw currentUser.error;
  }
  return <>{children ?? <Outlet />}</>;
}
