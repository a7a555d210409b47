import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { forgetFirstReads, signedInQueryClient } from '../api/queryClient';
import { SignedInFrame } from './SignedInFrame';

/**
 * The signed-in area with its query cache. The cache lives here, not at the
 * root, so the pages before sign-in load no query library, and each sign-in
 * starts with an empty cache (leaving the area drops it), or with the reads
 * of a page the server drew with its data.
 */
export function ShopFrame() {
  const [queryClient] = useState(signedInQueryClient);
  useEffect(forgetFirstReads, []);
  return (
    <QueryClientProvider client={queryClient}>
      <SignedInFrame />
    </QueryClientProvider>
  );
}
