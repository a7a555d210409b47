import { parseLayout, type Layout, type LayoutParseResult } from '../../geometry';
import { HttpError } from '../errors';

/** Every layout document that enters the database passes here: migrated, validated, repaired. */
export function validLayout(document: unknown): { layout: Layout; repairs: readonly string[] } {
  return validParsed(parseLayout(document));
}

/** A parse result as the layout, or the 400 naming each field that is wrong. */
export function validParsed(parsed: LayoutParseResult): { layout: Layout; repairs: readonly string[] } {
  if (parsed.ok) return { layout: parsed.layout, repairs: parsed.repairs };
  const fields: Record<string, string> = {};
  for (const issue of parsed.issues) fields[`document${issue.path ? `.${issue.path}` : ''}`] ??= issue.message;
  throw new HttpError(400, 'invalid_layout', 'The layout is not valid; nothing was saved', fields);
}
