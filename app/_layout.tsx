import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Slot } from 'expo-router';
import { useState } from 'react';
import { fontSources } from '../features/ui/fontSources';

export { ErrorBoundary } from 'expo-router';

export default function RootLayout() {
  const [loaded, failed] = useFonts(fontSources);
  const [queryClient] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 15_000 } } }));
  // A missing font is not worth a blank screen: fall back to the system face.
  if (!loaded && !failed) return null;
  return (
    <QueryClientProvider client={queryClient}>
      <Slot />
    </QueryClientProvider>
  );
}
