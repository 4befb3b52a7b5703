import { useMediaQuery } from '../../../lib/use-media-query';

/** True from the `sm` breakpoint up; charts give their labels more room there. */
export function useWideScreen(): boolean {
  return useMediaQuery('(min-width: 640px)', true);
}
