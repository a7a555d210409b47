import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useLayoutEffect, useState } from 'react';
import { Dimensions } from 'react-native';
import { forgetFirstReads, signedInQueryClient } from '../api/queryClient';
import { rememberView } from '../ui/pageView';
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
  // The window, locale and time zone the server draws this browser's next signed-in page for:
  // written as the area opens (before its first paint, so a page opened right after sign-in
  // is drawn too), and again when the window changes size. Not on the pages before sign-in,
  // whose start would wait for the browser's locale data.
  useLayoutEffect(() => {
    rememberView();
    const subscription = Dimensions.addEventListener('change', rememberView);
    return () => subscription.remove();
  }, []);
  return (
    <QueryClientProvider client={queryClient}>
      <SignedInFrame />
    </QueryClientProvider>
  );
}
