import { useState } from 'react';

/**
 * Filters that live in the address (the search params), for a form whose every change applies
 * at once. A change starts a navigation, and a data route's address changes only once its loader
 * has answered; until then a controlled <select> would be put back to the old value, and a
 * second quick arrow-key press would start from there — the person's choice lost. So what was
 * chosen shows at once, and a second quick change builds on the first, until the address moves
 * on (to the choice, or anywhere else: back button, a link), which is the truth again.
 */
export function useAddressFilters<T extends object>(current: T, go: (next: T) => void): [shown: T, choose: (change: Partial<T>) => void] {
  const key = JSON.stringify(current);
  const [pending, setPending] = useState<{ from: string; value: T } | null>(null);
  const shown = pending && pending.from === key ? pending.value : current;
  const choose = (change: Partial<T>) => {
    const next = { ...shown, ...change };
    setPending({ from: key, value: next });
    go(next);
  };
  return [shown, choose];
}
