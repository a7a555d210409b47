import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useState } from 'react';
import { SignedInFrame } from './SignedInFrame';

/**
 * The signed-in area with its query cache. The cache lives here, not at the
 * root, so the pages before sign-in load no query library, and each sign-in
 * starts with an empty cache (leaving the area drops it).
 */
export function ShopFrame() {
  const [queryClient] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 15_000 } } }));
  return (
    <QueryClientProvider client={queryClient}>
      <SignedInFrame />
    </QueryClientProvider>
  );
}
