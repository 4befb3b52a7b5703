import { startTransition, Suspense, useEffect, useState, type ReactNode } from 'react';
import { afterNextPaint } from '../../lib/after-paint';

/**
 * Renders `fallback` until the browser has painted the page once, then `children` (inside a
 * Suspense boundary with the same fallback, for lazy parts).
 *
 * React.lazy starts fetching a chunk while the page is still being rendered, so a part below the
 * fold that is lazy still has its code downloaded and run before the page's first paint: on
 * "open a case" the form's chunks (about 70 kB) were fetched, and their scripts run, between the
 * render and the paint of the page's lead text. Measured with Lighthouse, every request begun
 * before the largest text is painted counts in its simulated time. Waiting two frames lets the
 * page paint first; then the part comes as before.
 *
 * The part is rendered in a transition, which React renders in slices, giving the main thread
 * back every few milliseconds, instead of in one task (the open-case form or the thread with
 * its closing panel: 150-300 ms tasks at Lighthouse's 4x CPU slowdown, most of the case page's
 * total blocking time). Lighthouse, case and open a case, 6 runs each, alternating builds in
 * one session: total blocking time median 322 -> 103 ms on the case page, performance median
 * 88.5 -> 95 there and 95 -> 94 on open a case; no run below 91 with it (5 of 12 without).
 */
export function AfterFirstPaint({ fallback, children }: { fallback: ReactNode; children: ReactNode }) {
  const painted = useAfterFirstPaint();
  return <Suspense fallback={fallback}>{painted ? children : fallback}</Suspense>;
}

/** False on the first render; true once a frame has been drawn after it. */
export function useAfterFirstPaint(): boolean {
  const [painted, setPainted] = useState(false);
  useEffect(() => {
    if (painted) return;
    return afterNextPaint(() => startTransition(() => setPainted(true)));
  }, [painted]);
  return painted;
}
