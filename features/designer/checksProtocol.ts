import type { Finding, Layout, LayoutEngine, LengthRounding, Opening } from '../../geometry';
// The engine alone, not the geometry index, so the worker's file holds only what the checks need.
import { createLayoutEngine } from '../../geometry/engine';

/**
 * The layout checks as messages, so they can run beside the page (a Web
 * Worker in the browser) while the framer drags. The designer numbers every
 * layout it asks about; one question is out at a time and a newer one
 * replaces any still waiting, so the worker never falls behind the pointer
 * by more than one answer. An answer older than one already shown is
 * dropped: the newest layout's findings always win.
 *
 * Copying a message costs the page time, and a traced garment is thousands
 * of points, so an opening whose shape is the very object sent last time
 * goes with `{ kind: 'kept' }` in its place; the answering side keeps the
 * last shape of each opening. When it has none (it started afresh), it
 * answers `missing` and the question is asked again in full.
 */

/** How findings name openings and lengths; plain data, so it crosses to a worker. */
export interface ChecksWords {
  readonly openingNames?: ReadonlyMap<string, string>;
  readonly rounding?: LengthRounding;
}

type Shape = Opening['shape'];

/** In place of a shape: the same shape this opening had in the last layout sent. */
export interface KeptShape {
  readonly kind: 'kept';
}

/** A layout as sent: each opening with its shape, or with `kept` when the shape has not changed. */
export interface SentLayout extends Omit<Layout, 'openings'> {
  readonly openings: readonly (Omit<Opening, 'shape'> & { readonly shape: Shape | KeptShape })[];
}

export interface ChecksRequest {
  readonly revision: number;
  readonly layout: SentLayout;
  readonly words: ChecksWords;
}

export type ChecksReply =
  | { readonly revision: number; readonly findings: Finding[] }
  | { readonly revision: number; readonly error: string }
  | { readonly revision: number; readonly missing: true };

const KEPT: KeptShape = { kind: 'kept' };

/** The layout to send, and the shapes the other side holds once it has it. */
function layoutToSend(layout: Layout, held: ReadonlyMap<string, Shape>): { sent: SentLayout; holds: Map<string, Shape> } {
  const holds = new Map<string, Shape>();
  const openings = layout.openings.map((o) => {
    holds.set(o.id, o.shape);
    return held.get(o.id) === o.shape ? { ...o, shape: KEPT } : o;
  });
  return { sent: { ...layout, openings }, holds };
}

/** The layout back whole, or null when a kept shape is not held. */
function layoutReceived(sent: SentLayout, held: Map<string, Shape>): Layout | null {
  const openings: Opening[] = [];
  for (const o of sent.openings) {
    const shape = o.shape.kind === 'kept' ? held.get(o.id) : o.shape;
    if (!shape) return null;
    openings.push({ ...o, shape });
  }
  held.clear();
  for (const o of openings) held.set(o.id, o.shape);
  return { ...sent, openings };
}

/** What a Worker, a MessagePort and the in-page fallback have in common. */
export interface ChecksPort {
  postMessage(message: ChecksRequest): void;
  onmessage: ((event: { data: ChecksReply }) => void) | null;
  close(): void;
}

function wordsKey(words: ChecksWords): string {
  const names = [...(words.openingNames ?? new Map<string, string>())].map(([id, name]) => `${id}=${name}`).join(';');
  return `${words.rounding ?? ''}|${names}`;
}

/**
 * The answering side: one engine with a memory, kept while the words stay
 * the same, so a drag recomputes only what moved. The same engine code the
 * server runs at freeze and export.
 */
export function createChecksResponder(): (request: ChecksRequest) => ChecksReply {
  let engine: LayoutEngine | null = null;
  let key = '';
  const shapes = new Map<string, Shape>();
  return ({ revision, layout: sent, words }) => {
    const layout = layoutReceived(sent, shapes);
    if (!layout) return { revision, missing: true };
    const nextKey = wordsKey(words);
    if (!engine || nextKey !== key) {
      engine = createLayoutEngine(words);
      key = nextKey;
    }
    try {
      return { revision, findings: engine.check(layout) };
    } catch (error) {
      return { revision, error: error instanceof Error ? error.message : String(error) };
    }
  };
}

/** One answer as the designer uses it: the findings and the layout they are about. */
export interface ChecksResult {
  readonly revision: number;
  readonly layout: Layout;
  readonly findings: readonly Finding[];
}

export interface ChecksClient {
  /** Asks about `layout`; returns its revision. */
  request(layout: Layout, words: ChecksWords): number;
  close(): void;
}

export function createChecksClient(port: ChecksPort, onResult: (result: ChecksResult) => void, onError: (message: string) => void = () => undefined): ChecksClient {
  interface Question {
    readonly revision: number;
    readonly layout: Layout;
    readonly words: ChecksWords;
  }
  let revision = 0;
  let shown = 0;
  let held: ReadonlyMap<string, Shape> = new Map();
  let inFlight: Question | null = null;
  let waiting: Question | null = null;

  const send = (question: Question) => {
    inFlight = question;
    const { sent, holds } = layoutToSend(question.layout, held);
    held = holds;
    port.postMessage({ revision: question.revision, layout: sent, words: question.words });
  };

  port.onmessage = ({ data: reply }) => {
    const asked = inFlight && inFlight.revision === reply.revision ? inFlight : null;
    if (asked && 'missing' in reply) {
      held = new Map();
      send(asked);
      return;
    }
    if (asked) inFlight = null;
    if (!inFlight && waiting) {
      const next = waiting;
      waiting = null;
      send(next);
    }
    if (!asked || reply.revision <= shown || 'missing' in reply) return;
    shown = reply.revision;
    if ('error' in reply) onError(reply.error);
    else onResult({ revision: reply.revision, layout: asked.layout, findings: reply.findings });
  };

  return {
    request(layout, words) {
      const question: Question = { revision: ++revision, layout, words };
      if (inFlight) waiting = question;
      else send(question);
      return question.revision;
    },
    close() {
      port.onmessage = null;
      port.close();
    },
  };
}

/** The checks in the page itself, answered after the current task, for where no worker can run. */
export function inPagePort(): ChecksPort {
  const respond = createChecksResponder();
  let open = true;
  const port: ChecksPort = {
    onmessage: null,
    postMessage(message) {
      setTimeout(() => {
        if (!open) return;
        const reply = respond(message);
        port.onmessage?.({ data: reply });
      }, 0);
    },
    close() {
      open = false;
    },
  };
  return port;
}
