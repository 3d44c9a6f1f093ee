import { ChakraProvider } from '@chakra-ui/react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
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
      {/* One paper-and-ink theme: index.html sets the light class on <html>. */}
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    </ChakraProvider>
  );
}
