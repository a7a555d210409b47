const FOCUSABLE = 'input, textarea, select, button, [tabindex]:not([tabindex="-1"])';

/**
 * Moves focus to the first field marked aria-invalid on the page, so after a
 * failed submit the keyboard and the screen reader land on the first mistake
 * with its message. A group (a row of choices) passes focus to its first member.
 */
export function focusFirstInvalid(): void {
  const first = document.querySelector<HTMLElement>('[aria-invalid="true"]');
  if (!first) return;
  const target = first.matches(FOCUSABLE) ? first : first.querySelector<HTMLElement>(FOCUSABLE);
  target?.focus();
  target?.scrollIntoView?.({ block: 'center' });
}
