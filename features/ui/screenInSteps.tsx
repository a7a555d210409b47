import { startTransition, useEffect, useState, type ComponentType } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { inTurns } from './inTurns';
import { colors, space } from './theme';

/** One group of modules to evaluate, by a `require` of the module that heads it. */
export type ModuleStep = () => unknown;

/**
 * A screen whose modules are evaluated a group at a time, one task each,
 * before it is first drawn. A route's code arrives as one script, and the
 * first `require` of its screen evaluates every module the screen needs in a
 * single task: for the designer (clipper, the geometry, the schemas, the SVG
 * canvas) over a second on a phone, with no tap answered meanwhile. Here the
 * browser gets a turn between groups (as `index.ts` does for the framework);
 * the screen is drawn once the last group is in, with the loading wheel the
 * screen itself shows while its data loads until then.
 *
 * `steps` go from the modules others need to those that need them, so each
 * `require` finds its own imports already evaluated. Once evaluated (coming
 * back to the screen), or where there is no document to draw in, the screen
 * is drawn at once.
 */
export function screenInSteps<P extends object>(
  steps: readonly ModuleStep[],
  /** The screen, once its modules are in; or a promise of it, for code fetched as a script of its own (`import()`). */
  screen: () => ComponentType<P> | Promise<ComponentType<P>>,
  /** What shows until then; the default is a loading wheel near the top of the page. */
  Waiting?: ComponentType,
): ComponentType<P> {
  let evaluated: ComponentType<P> | null = null;
  let running: Promise<ComponentType<P>> | null = null;

  /** Where there is no document (the build's pre-rendering): the screen now, or null (the wait) when it is fetched. */
  const atOnce = (): ComponentType<P> | null => {
    for (const step of steps) step();
    const ready = screen();
    if (ready instanceof Promise) {
      ready.catch(() => undefined);
      return null;
    }
    evaluated = ready;
    return evaluated;
  };
  const stepped = (): Promise<ComponentType<P>> =>
    (running ??= inTurns(steps)
      .then(screen)
      .then((ready) => {
        evaluated = ready;
        return ready;
      })
      .catch((error: unknown) => {
        // A script that could not be fetched is fetched again on the next try.
        running = null;
        throw error;
      }));

  function ScreenInSteps(props: P) {
    const [Screen, setScreen] = useState<ComponentType<P> | null>(() => evaluated ?? (typeof document === 'undefined' ? atOnce() : null));
    const [failure, setFailure] = useState<{ error: unknown } | null>(null);
    useEffect(() => {
      if (Screen) return;
      let live = true;
      stepped().then(
        // A transition, so React draws the screen in short slices rather than one task.
        (ready) => live && startTransition(() => setScreen(() => ready)),
        (error: unknown) => live && setFailure({ error }),
      );
      return () => {
        live = false;
      };
    }, [Screen]);
    // A module that fails to evaluate is the route's error, shown by its error boundary.
    if (failure) throw failure.error;
    if (!Screen && Waiting) return <Waiting />;
    if (!Screen) {
      return (
        <View style={styles.page}>
          <ActivityIndicator color={colors.accent} style={styles.loading} />
        </View>
      );
    }
    return <Screen {...props} />;
  }
  return ScreenInSteps;
}

const styles = StyleSheet.create({
  page: { flex: 1, backgroundColor: colors.paper },
  loading: { marginTop: space.xxl },
});
