import type { BoardPoint } from '../../geometry';
import { draftSaveInput } from '../../features/layouts/schema';
import { HttpError, parseOr400 } from '../errors';
import { splitDraft, withListsPutBack, type StoredDraft } from '../services/draftOutlines';
import { validLayout } from '../services/validLayout';

/**
 * A draft save read from the request's text in one pass: JSON, the request's
 * schema, the outlines it keeps by name put back, then the layout's parse
 * and repairs, and the layout split for storage (server/services/draftOutlines.ts).
 * Pure, so a large document (a traced garment of thousands of points) is
 * read on a compute thread: the web server's event loop only moves its
 * text, never parses or walks it.
 */

export interface DraftSaveRead extends StoredDraft {
  readonly baseRevision: number;
  readonly repairs: readonly string[];
  /** Names the save kept without sending their points: the stored draft must hold each. */
  readonly kept: readonly string[];
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

/**
 * A request body already parsed (or absent): the same 400s naming the fields,
 * then the layout. `lists` holds the points of every outline the document
 * names, already checked.
 */
export function readDraftSave(body: unknown, lists: ReadonlyMap<string, readonly BoardPoint[]> = new Map()): DraftSaveRead {
  const input = parseOr400(draftSaveInput, body);
  const { layout, repairs } = validLayout(withListsPutBack(input.document, lists));
  const stored = splitDraft(layout, new Set(lists.keys()));
  const kept = stored.refs.filter((ref) => lists.has(ref));
  return { ...stored, baseRevision: input.baseRevision, repairs, kept };
}

export function readDraftSaveText(text: string, lists?: ReadonlyMap<string, readonly BoardPoint[]>): DraftSaveRead {
  return readDraftSave(parseJsonBody(text), lists);
}
