import { useSyncExternalStore } from "react";

const subscribe = () => () => {};

/**
 * False in the server-rendered HTML and until the island has hydrated. Submit buttons stay disabled
 * until then, so an early click can never fall back to a native form submission (which would put the
 * fields, passwords included, into the page's URL). React renders the server snapshot (false) while
 * hydrating and the client snapshot (true) right after.
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
