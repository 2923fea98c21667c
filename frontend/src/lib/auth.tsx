import { createContext, useCallback, useContext, useEffect, useMemo, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { LoginRequest, SessionUser } from '@amberline/common';
import { login as loginRequest, meQueryOptions, useMe } from './auth-api';
import { ApiError, setUnauthorizedHandler, tokenStore } from './api-client';

/** The signed-in user as last confirmed by the server: kept through an outage, so a 503 does not sign anyone out. */
const USER_KEY = 'amberline.user';
const lastUser = {
  get: (): SessionUser | null => {
    try {
      return JSON.parse(localStorage.getItem(USER_KEY) ?? 'null') as SessionUser | null;
    } catch {
      return null;
    }
  },
  set: (u: SessionUser) => localStorage.setItem(USER_KEY, JSON.stringify(u)),
  clear: () => localStorage.removeItem(USER_KEY),
};

type AuthState = {
  user: SessionUser | null;
  loading: boolean;
  signIn: (body: LoginRequest) => Promise<SessionUser>;
  signOut: () => void;
};

const AuthContext = createContext<AuthState | null>(null);

export function AuthProvider({ children }: { children: ReactNode }) {
  const qc = useQueryClient();
  const me = useMe();

  const signOut = useCallback(() => {
    tokenStore.clear();
    lastUser.clear();
    qc.clear();
    qc.setQueryData(meQueryOptions().queryKey, null as unknown as SessionUser);
  }, [qc]);

  useEffect(() => setUnauthorizedHandler(signOut), [signOut]);

  const signIn = useCallback(
    async (body: LoginRequest) => {
      const res = await loginRequest(body);
      tokenStore.set(res.accessToken);
      lastUser.set(res.user);
      qc.setQueryData(meQueryOptions().queryKey, res.user);
      return res.user;
    },
    [qc],
  );

  useEffect(() => {
    if (me.data) lastUser.set(me.data);
  }, [me.data]);
  // the server could not be reached or answered 503: the session stands, the shell says the service is unavailable
  const outage = me.isError && !(me.error instanceof ApiError && me.error.status < 500);
  const value = useMemo<AuthState>(
    () => ({ user: tokenStore.get() ? me.data ?? (outage ? lastUser.get() : null) : null, loading: !!tokenStore.get() && me.isPending, signIn, signOut }),
    [me.data, me.isPending, outage, signIn, signOut],
  );
  return <AuthContext.Provider value={value}>{children}</AuthContext.Provider>;
}

export function useAuth(): AuthState {
  const ctx = useContext(AuthContext);
  if (!ctx) throw new Error('useAuth outside AuthProvider');
  return ctx;
}
