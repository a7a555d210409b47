/** Moves focus to the first field marked invalid; the browser build does the work (focusFirstInvalid.web.ts). */
export function focusFirstInvalid(): void {
  // Native screens read errors through each field's own description.
}
