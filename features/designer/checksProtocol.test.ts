import { describe, expect, it } from 'vitest';
import type { Layout } from '../../geometry';
import { checkLayout } from '../../geometry';
import { benchLayout } from '../../scripts/benchLayout';
import type { ChecksPort, ChecksReply, ChecksRequest, ChecksResult } from './checksProtocol';
import { createChecksClient, createChecksResponder } from './checksProtocol';

/**
 * The checks' messages between the designer and its worker. The answering
 * side runs on the far end of a real MessageChannel, which copies every
 * message with the structured clone of the HTML standard, as a browser does
 * between a page and a Web Worker.
 */

interface Channel {
  port: ChecksPort;
  sent: ChecksRequest[];
}

/** The responder on one end of a MessageChannel; `sent` keeps each question as it crossed. */
function workerChannel(): Channel {
  const { port1, port2 } = new MessageChannel();
  const respond = createChecksResponder();
  const sent: ChecksRequest[] = [];
  port1.onmessage = (event: MessageEvent<ChecksRequest>) => {
    sent.push(event.data);
    port1.postMessage(respond(event.data));
  };
  const port: ChecksPort = {
    onmessage: null,
    postMessage: (message) => port2.postMessage(message),
    close: () => {
      port1.close();
      port2.close();
    },
  };
  port2.onmessage = (event: MessageEvent<ChecksReply>) => port.onmessage?.(event);
  return { port, sent };
}

function shifted(layout: Layout, id: string, dx: number): Layout {
  return { ...layout, openings: layout.openings.map((o) => (o.id === id ? { ...o, center: { x: o.center.x + dx, y: o.center.y } } : o)) };
}

/** The benchmark shadowbox crowded so it has findings: a patch 2 in nearer the photo, the garment 2 in over a card. */
function crowdedBenchLayout(): Layout {
  return shifted(shifted(benchLayout(2000), 'patch-left', 2), 'jersey', -2);
}

function nextResult(results: ChecksResult[], count: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const started = Date.now();
    const poll = () => (results.length >= count ? resolve() : Date.now() - started > 20_000 ? reject(new Error('no answer')) : setTimeout(poll, 5));
    poll();
  });
}

/** What a finding is, without its words: its code, which openings and mat, and the measured and required values. */
const essentials = (findings: readonly { code: string; openingIds?: readonly string[]; matIndex?: number; measured: number | null; required: number | null }[]) =>
  findings.map((f) => ({ code: f.code, openingIds: f.openingIds, matIndex: f.matIndex, measured: f.measured, required: f.required }));

describe('the checks across a worker channel', () => {
  it('answers the benchmark shadowbox with the same findings as the engine on the page', { timeout: 60_000 }, async () => {
    const layout = crowdedBenchLayout();
    const { port } = workerChannel();
    const results: ChecksResult[] = [];
    const client = createChecksClient(port, (r) => results.push(r));
    client.request(layout, {});
    await nextResult(results, 1);
    client.close();
    const onPage = checkLayout(layout);
    // The checks' own reference is the engine itself (geometry/engine.ts): across the channel nothing may change.
    expect(onPage.map((f) => f.code).sort()).toEqual(['bridge-narrow', 'openings-overlap']);
    expect(results[0]!.layout).toBe(layout);
    expect(essentials(results[0]!.findings)).toEqual(essentials(onPage));
    expect(results[0]!.findings.map((f) => f.message)).toEqual(onPage.map((f) => f.message));
  });

  it('while dragging, asks one question at a time, lets the newest replace the waiting ones and sends unchanged shapes as kept', { timeout: 60_000 }, async () => {
    const start = crowdedBenchLayout();
    const { port, sent } = workerChannel();
    const results: ChecksResult[] = [];
    const client = createChecksClient(port, (r) => results.push(r));
    const frames = [1, 2, 3, 4, 5].map((i) => shifted(start, 'patch-left', i * 0.125));
    const revisions = frames.map((layout) => client.request(layout, {}));
    await nextResult(results, 2);
    client.close();
    // Common practice for live previews: the first question and then only the latest; frames 2 to 4 were never asked.
    expect(revisions).toEqual([1, 2, 3, 4, 5]);
    expect(sent.map((r) => r.revision)).toEqual([1, 5]);
    expect(results.map((r) => r.revision)).toEqual([1, 5]);
    expect(results[1]!.layout).toBe(frames[4]);
    expect(results[1]!.findings.length).toBeGreaterThan(0);
    expect(essentials(results[1]!.findings)).toEqual(essentials(checkLayout(frames[4]!)));
    // The first question carries every shape; the second only refers to them, so the 2 000-point outline crosses once.
    expect(sent[0]!.layout.openings.every((o) => o.shape.kind !== 'kept')).toBe(true);
    expect(sent[1]!.layout.openings.every((o) => o.shape.kind === 'kept')).toBe(true);
    expect(JSON.stringify(sent[1]!.layout).length).toBeLessThan(JSON.stringify(sent[0]!.layout).length / 20);
  });
});

describe('answers out of turn', () => {
  /** A port whose far side the test plays by hand. */
  function handPort(): { port: ChecksPort; asked: ChecksRequest[]; answer: (reply: ChecksReply) => void } {
    const asked: ChecksRequest[] = [];
    const port: ChecksPort = { onmessage: null, postMessage: (m) => asked.push(m), close: () => undefined };
    return { port, asked, answer: (reply) => port.onmessage?.({ data: reply }) };
  }

  it('drops an answer to a question that is not the one asked, or older than one shown', () => {
    const { port, asked, answer } = handPort();
    const shown: number[] = [];
    const client = createChecksClient(port, (r) => shown.push(r.revision));
    const layout = benchLayout(200);
    client.request(layout, {});
    client.request(shifted(layout, 'photo', 0.5), {});
    expect(asked.map((r) => r.revision)).toEqual([1]);
    answer({ revision: 1, findings: [] });
    expect(asked.map((r) => r.revision)).toEqual([1, 2]);
    // A late copy of the first answer arrives while the second question is out: stale, so it is not shown again.
    answer({ revision: 1, findings: [] });
    answer({ revision: 2, findings: [] });
    answer({ revision: 2, findings: [] });
    expect(shown).toEqual([1, 2]);
  });

  it('asks again in full when the far side no longer holds the shapes it was told were kept', async () => {
    const layout = benchLayout(200);
    const { port, asked, answer } = handPort();
    const shown: ChecksResult[] = [];
    const client = createChecksClient(port, (r) => shown.push(r));
    const fresh = createChecksResponder();
    client.request(layout, {});
    answer({ revision: 1, findings: [] });
    client.request(shifted(layout, 'photo', 0.5), {});
    // A worker started afresh (after a failure) holds no shapes: it says so and gets the whole layout.
    const reply = fresh(asked[1]!);
    expect(reply).toEqual({ revision: 2, missing: true });
    answer(reply);
    expect(asked).toHaveLength(3);
    expect(asked[2]!.revision).toBe(2);
    expect(asked[2]!.layout.openings.every((o) => o.shape.kind !== 'kept')).toBe(true);
    answer(fresh(asked[2]!));
    expect(shown.map((r) => r.revision)).toEqual([1, 2]);
    expect(essentials(shown[1]!.findings)).toEqual(essentials(checkLayout(shifted(layout, 'photo', 0.5))));
  });
});
