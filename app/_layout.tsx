import { Slot } from 'expo-router';
import { useAppFonts } from '../features/ui/useAppFonts';

export { PageError as ErrorBoundary } from '../features/ui/PageError';

export default function RootLayout() {
  const fontsReady = useAppFonts();
  // A missing font is not worth a blank screen: fall back to the system face.
  if (!fontsReady) return null;
  return <Slot />;
}
