// Waiting for the browser's next paint, so work that is not needed for it (a chunk below the
// fold, the live connection) does not run, or fetch, before the page is on screen.

// The browser stops reporting largest paints at the first tap, key or scroll.
let interacted = false;
if (typeof window !== 'undefined') {
  const stop = () => {
    interacted = true;
  };
  for (const type of ['pointerdown', 'keydown', 'scroll']) window.addEventListener(type, stop, { capture: true, once: true, passive: true });
}

/**
 * Calls `then` once the browser has drawn a frame after now: two animation frames, as the first
 * runs before that frame's paint. A frame drawn is shown a few frames later, though (Chromium
 * without a GPU: 30-50 ms in the browser tests), so while the page is still loading for the first
 * time this also waits for the browser to report a largest paint after now, or 250 ms more. A tab
 * in the background draws no frames, so a timer stands in. Returns a function that cancels.
 */
export function afterNextPaint(then: () => void): () => void {
  const since = performance.now();
  let second = 0;
  let wait: ReturnType<typeof setTimeout> | undefined;
  let observer: PerformanceObserver | undefined;
  let done = false;
  const once = () => {
    if (done) return;
    done = true;
    cancel();
    then();
  };
  const framesDrawn = () => {
    if (interacted || typeof PerformanceObserver === 'undefined' || !PerformanceObserver.supportedEntryTypes?.includes('largest-contentful-paint')) return once();
    observer = new PerformanceObserver((list) => {
      if (list.getEntries().some((entry) => entry.startTime >= since)) once();
    });
    observer.observe({ type: 'largest-contentful-paint', buffered: true });
    wait = setTimeout(once, 250);
  };
  const first = requestAnimationFrame(() => {
    second = requestAnimationFrame(framesDrawn);
  });
  const fallback = setTimeout(once, 750);
  function cancel() {
    cancelAnimationFrame(first);
    cancelAnimationFrame(second);
    clearTimeout(fallback);
    clearTimeout(wait);
    observer?.disconnect();
  }
  return cancel;
}

let firstPaint: Promise<void> | null = null;

/** Settles once the app has been painted for the first time (and at once after that). */
export function appPainted(): Promise<void> {
  return (firstPaint ??= new Promise<void>((resolve) => {
    afterNextPaint(resolve);
  }));
}
