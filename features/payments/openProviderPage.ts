import * as Linking from 'expo-linking';

/** Opens the payment provider's page in the system browser. */
export function openProviderPage(url: string): void {
  void Linking.openURL(url);
}
