const entities: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Makes text safe to place inside HTML elements and quoted attributes; every user-supplied value goes through it. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => entities[c] ?? c);
}
