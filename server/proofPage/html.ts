/**
 * HTML made on the server from template literals. Every value put into a
 * template goes through `escapeHtml` unless it is already `SafeHtml` (made by
 * this module from escaped parts), so text a customer or a shop typed can
 * never become markup.
 */
export class SafeHtml {
  constructor(readonly text: string) {}
  toString() {
    return this.text;
  }
}

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** The one escape for text and attribute values (attributes are always double-quoted here). */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}

type Part = SafeHtml | string | number | null | undefined | false | readonly Part[];

function render(part: Part): string {
  if (part === null || part === undefined || part === false) return '';
  if (part instanceof SafeHtml) return part.text;
  if (Array.isArray(part)) return part.map(render).join('');
  return escapeHtml(String(part));
}

/** A template whose interpolations are escaped; arrays are joined, null, undefined and false leave nothing. */
export function html(strings: TemplateStringsArray, ...values: Part[]): SafeHtml {
  let out = strings[0]!;
  values.forEach((value, i) => {
    out += render(value) + strings[i + 1]!;
  });
  return new SafeHtml(out);
}

/** A number for an SVG attribute: finite, at most 4 decimals, no exponent. */
export function svgNumber(value: number): string {
  if (!Number.isFinite(value)) return '0';
  return String(Math.round(value * 10_000) / 10_000);
}
