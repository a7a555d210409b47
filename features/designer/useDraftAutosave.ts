import { useCallback, useEffect, useRef, useState } from 'react';
import type { Layout } from '../../geometry';
import { parseLayout } from '../../geometry/layout';
import { ApiError, apiClient } from '../api/client';
import { layoutDetail } from '../layouts/schema';
import { rememberOutlineNames, type OutlineNames } from '../layouts/outlineNames';
import { saveDraft } from '../layouts/queries';
import { useLeaveWarning } from './useLeaveWarning';

/** Long enough that a burst of nudges is one save, short enough that a closed tab loses little. */
export const AUTOSAVE_DELAY_MS = 1500;

export type SaveStatus = 'saved' | 'waiting' | 'saving' | 'failed' | 'conflict';

/** Someone else saved first: their draft, ready to load, and who it was. */
export interface SaveConflict {
  readonly theirs: Layout | null;
  readonly revision: number;
  readonly byName: string | null;
  /** The names the server keeps their outlines under, by opening id. */
  readonly outlineRefs: Readonly<Record<string, string>>;
}

interface Options {
  readonly layoutId: string;
  readonly layout: Layout;
  readonly initialRevision: number;
  /** The names the server keeps the loaded draft's outlines under, by opening id. */
  readonly initialOutlineRefs?: Readonly<Record<string, string>>;
  /** Front desk reads layouts but never saves them. */
  readonly enabled: boolean;
  /** Puts a document from the server into the editor (undo brings the edited one back). */
  readonly adopt: (layout: Layout) => void;
}

/**
 * Saves the draft a moment after the last change and when the designer is
 * left, always with the revision the edit started from. When someone else
 * saved first, nothing is overwritten: the conflict is shown and the framer
 * chooses.
 */
export function useDraftAutosave({ layoutId, layout, initialRevision, initialOutlineRefs = {}, enabled, adopt }: Options) {
  const [status, setStatus] = useState<SaveStatus>('saved');
  const [problem, setProblem] = useState<string | null>(null);
  const [conflict, setConflict] = useState<SaveConflict | null>(null);
  const revision = useRef(initialRevision);
  const saved = useRef(layout);
  const names = useRef<OutlineNames | null>(null);
  if (names.current === null) {
    names.current = new WeakMap();
    rememberOutlineNames(names.current, layout, initialOutlineRefs);
  }
  const latest = useRef(layout);
  const running = useRef<Promise<number | null> | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  latest.current = layout;
  const dirty = enabled && layout !== saved.current;
  useLeaveWarning(dirty);

  const loadConflict = useCallback(async () => {
    setStatus('conflict');
    const detail = await apiClient.get(`/layouts/${layoutId}`, layoutDetail).catch(() => null);
    if (!detail) return setConflict({ theirs: null, revision: revision.current, byName: null, outlineRefs: {} });
    const parsed = parseLayout(detail.layout.draft);
    setConflict({ theirs: parsed.ok ? parsed.layout : null, revision: detail.layout.draftRevision, byName: detail.layout.updatedByName, outlineRefs: detail.layout.outlineRefs });
  }, [layoutId]);

  const schedule = useCallback((run: () => void) => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(run, AUTOSAVE_DELAY_MS);
  }, []);

  const save = useCallback(async (): Promise<number | null> => {
    if (running.current) await running.current;
    const document = latest.current;
    if (document === saved.current) return revision.current;
    setStatus('saving');
    const attempt = saveDraft(layoutId, document, revision.current, names.current!).then(
      (result) => {
        revision.current = result.draftRevision;
        saved.current = document;
        setProblem(null);
        if (latest.current === document) setStatus('saved');
        else {
          // Edited while this save was out (perhaps undone back to an older draft): save that too.
          setStatus('waiting');
          schedule(() => void saveRef.current());
        }
        return result.draftRevision;
      },
      async (error: unknown) => {
        if (error instanceof ApiError && error.status === 409) await loadConflict();
        else {
          setStatus('failed');
          setProblem(error instanceof Error ? error.message : 'The draft could not be saved.');
        }
        return null;
      },
    );
    running.current = attempt;
    try {
      return await attempt;
    } finally {
      running.current = null;
    }
  }, [layoutId, loadConflict, schedule]);

  // Leaving the designer saves what is left; the request outlives the screen.
  const saveRef = useRef(save);
  saveRef.current = save;

  useEffect(() => {
    if (!enabled || conflict) return;
    if (layout === saved.current) {
      // Undone back to exactly what was last saved: nothing is waiting (a save still out
      // checks again when it comes back).
      if (!running.current) {
        setStatus('saved');
        setProblem(null);
      }
      return;
    }
    setStatus('waiting');
    schedule(() => void save());
    return () => {
      if (timer.current) clearTimeout(timer.current);
    };
  }, [layout, enabled, conflict, save, schedule]);
  useEffect(() => () => {
    if (enabled && latest.current !== saved.current) void saveRef.current();
  }, [enabled]);

  /** Saves now and answers the revision saved, or null when it could not be saved. */
  const flush = useCallback(async () => {
    if (timer.current) clearTimeout(timer.current);
    if (conflict) return null;
    return save();
  }, [conflict, save]);

  const loadTheirs = useCallback(() => {
    if (!conflict?.theirs) return;
    revision.current = conflict.revision;
    saved.current = conflict.theirs;
    rememberOutlineNames(names.current!, conflict.theirs, conflict.outlineRefs);
    adopt(conflict.theirs);
    setConflict(null);
    setStatus('saved');
  }, [adopt, conflict]);

  const keepMine = useCallback(() => {
    if (!conflict) return;
    revision.current = conflict.revision;
    setConflict(null);
    void save();
  }, [conflict, save]);

  return { status, problem, conflict, flush, loadTheirs, keepMine, revision: () => revision.current, noteConflict: loadConflict, retry: save };
}
