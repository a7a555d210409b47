/** Printing is a browser's job; on a phone app the packing list is read on screen. */
export const canPrint = false;
export function printPage(): void {}
