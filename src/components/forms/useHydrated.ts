import { useEffect, useState } from "react";

/**
 * False in the server-rendered HTML and until the island has hydrated. Submit buttons stay disabled
 * until then, so an early click can never fall back to a native form submission (which would put the
 * fields, passwords included, into the page's URL).
 */
export function useHydrated(): boolean {
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);
  return hydrated;
}
