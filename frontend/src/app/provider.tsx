import type { ReactNode } from 'react';
import { ConfigProvider } from 'antd';
import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '../lib/query-client';
import { AuthProvider } from '../lib/auth';
import { theme } from './theme';

export function AppProvider({ children }: { children: ReactNode }) {
  return (
    // antd's App (message, notification, modal hooks) wraps the signed-in shell and the public pages that need it,
    // not the root, so the sign-in page's first load stays light
    <ConfigProvider theme={theme}>
      <QueryClientProvider client={queryClient}>
        <AuthProvider>{children}</AuthProvider>
      </QueryClientProvider>
    </ConfigProvider>
  );
}
