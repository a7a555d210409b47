/** Goes to the payment provider's page in this tab; it sends the browser back to the job when paid or cancelled. */
export function openProviderPage(url: string): void {
  window.location.assign(url);
}
