import { useFonts } from 'expo-font';
import { fontSources } from './fontSources';

/** True once the shipped typeface can be drawn (or failed to load: the system face stands in). */
export function useAppFonts(): boolean {
  const [loaded, failed] = useFonts(fontSources);
  return loaded || failed !== null;
}
