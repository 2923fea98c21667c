import { createContext, useCallback, useContext, useEffect, useMemo, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { LoginRequest, SessionUser } from '@amberline/common';
import { login as loginRequest } from '../features/auth/api/login';
import { meQueryOptions, useMe } from '../features/auth/api/get-me';
import { setUnauthorizedHandler, tokenStore } from './api-client';

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
    qc.clear();
    qc.setQueryData(meQueryOptions().queryKey, null as unknown as SessionUser);
  }, [qc]);

  useEffect(() => setUnauthorizedHandler(signOut), [signOut]);

  const signIn = useCallback(
    async (body: LoginRequest) => {
      const res = await loginRequest(body);
      tokenStore.set(res.accessToken);
      qc.setQueryData(meQueryOptions().queryKey, res.user);
      return res.user;
    },
    [qc],
  );

  const value = useMemo<AuthState>(
    () => ({ user: tokenStore.get() ? me.data ?? null : null, loading: !!tokenStore.get() && me.isPending, signIn, signOut }),
    [me.data, me.isPending, signIn, signOut],
  );
  return <AuthContext.Provider value={value}>{children}</AuthContext.Provider>;
}

export function useAuth(): AuthState {
  const ctx = useContext(AuthContext);
  if (!ctx) throw new Error('useAuth outside AuthProvider');
  return ctx;
}
