import { useSyncExternalStore } from 'react';

const subscribe = () => () => {};

/** False while React hydrates the server's HTML, true afterwards (for local times, "now"). */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
