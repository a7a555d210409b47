import { Slot } from 'expo-router';
import { applyServerWindow } from '../features/ui/pageView';
import { useAppFonts } from '../features/ui/useAppFonts';

export { PageError as ErrorBoundary } from '../features/ui/PageError';

export default function RootLayout() {
  // On the server, the window the page is drawn for (a no-op in the browser).
  applyServerWindow();
  const fontsReady = useAppFonts();
  // A missing font is not worth a blank screen: fall back to the system face.
  if (!fontsReady) return null;
  return <Slot />;
}
