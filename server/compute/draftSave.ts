import { draftSaveInput } from '../../features/layouts/schema';
import { HttpError, parseOr400 } from '../errors';
import { validLayout } from '../services/validLayout';

/**
 * A draft save read from the request's text in one pass: JSON, the request's
 * schema, then the layout's parse and repairs, and the layout written back
 * as the JSON to store. Pure, so a large document (a traced garment of
 * thousands of points) is read on a compute thread: the web server's event
 * loop only moves its text, never parses or walks it.
 */

export interface DraftSaveRead {
  readonly baseRevision: number;
  /** The parsed and repaired layout as JSON text, stored as it is. */
  readonly layoutJson: string;
  readonly repairs: readonly string[];
}

const invalidJson = () => new HttpError(400, 'invalid_json', 'The request body is not valid JSON');

/** JSON.parse with the body parser's strict rule (an object or an array at the top) and its 400. */
export function parseJsonBody(text: string): unknown {
  const first = /^[ \t\n\r]*([^ \t\n\r])/.exec(text)?.[1];
  if (first !== '{' && first !== '[') throw invalidJson();
  try {
    return JSON.parse(text);
  } catch {
    throw invalidJson();
  }
}

/** A request body already parsed (or absent): the same 400s naming the fields, then the layout. */
export function readDraftSave(body: unknown): DraftSaveRead {
  const input = parseOr400(draftSaveInput, body);
  const { layout, repairs } = validLayout(input.document);
  return { baseRevision: input.baseRevision, layoutJson: JSON.stringify(layout), repairs };
}

export function readDraftSaveText(text: string): DraftSaveRead {
  return readDraftSave(parseJsonBody(text));
}
