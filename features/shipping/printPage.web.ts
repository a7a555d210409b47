/** The browser's own print dialog; the packing list prints with the page. */
export const canPrint = true;
export function printPage(): void {
  window.print();
}
