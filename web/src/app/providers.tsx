import { ChakraProvider } from '@chakra-ui/react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { ThemeProvider } from 'next-themes';
import { useState, type ReactNode } from 'react';
import { createQueryClient } from '@/lib/query-client';
import { system } from '@/lib/theme';

interface AppProvidersProps {
  children: ReactNode;
  /** Tests pass their own client so every test starts with an empty cache. */
  queryClient?: QueryClient;
}

export function AppProviders({ children, queryClient }: AppProvidersProps) {
  const [client] = useState(() => queryClient ?? createQueryClient());
  return (
    <ChakraProvider value={system}>
      {/* One paper-and-ink theme for now; next-themes keeps the class on <html> in step. */}
      <ThemeProvider attribute="class" forcedTheme="light" disableTransitionOnChange>
        <QueryClientProvider client={client}>{children}</QueryClientProvider>
      </ThemeProvider>
    </ChakraProvider>
  );
}
