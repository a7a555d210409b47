import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { useState } from 'react';
import { useAppFonts } from '../features/ui/useAppFonts';

export { PageError as ErrorBoundary } from '../features/ui/PageError';

export default function RootLayout() {
  const fontsReady = useAppFonts();
  const [queryClient] = useState(() => new QueryClient({ defaultOptions: { queries: { staleTime: 15_000 } } }));
  // A missing font is not worth a blank screen: fall back to the system face.
  if (!fontsReady) return null;
  return (
    <QueryClientProvider client={queryClient}>
      <Slot />
    </QueryClientProvider>
  );
}
