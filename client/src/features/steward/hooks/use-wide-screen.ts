import { useSyncExternalStore } from 'react';

const QUERY = '(min-width: 640px)';

/** True from the `sm` breakpoint up; charts give their labels more room there. */
export function useWideScreen(): boolean {
  return useSyncExternalStore(
    (onChange) => {
      const media = window.matchMedia(QUERY);
      media.addEventListener('change', onChange);
      return () => media.removeEventListener('change', onChange);
    },
    () => window.matchMedia(QUERY).matches,
    () => true,
  );
}
