import { useSyncExternalStore } from 'react';

/** Whether a CSS media query matches now; the component renders again when that changes. */
export function useMediaQuery(query: string, serverAnswer = false): boolean {
  return useSyncExternalStore(
    (onChange) => {
      const media = window.matchMedia(query);
      media.addEventListener('change', onChange);
      return () => media.removeEventListener('change', onChange);
    },
    () => window.matchMedia(query).matches,
    () => serverAnswer,
  );
}

/**
 * True when no pointer can hover finely: a phone or tablet used by touch alone. Its on-screen
 * keyboard has no Shift key to hold with Enter, so Enter there must be free to start a new line.
 */
export function useTouchOnly(): boolean {
  return !useMediaQuery('(any-pointer: fine)', true);
}
