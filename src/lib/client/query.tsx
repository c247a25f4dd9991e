/**
 * TanStack Query for islands. Each Astro island is its own React root, so each gets a QueryClient
 * through `withQueryClient`; queries read the REST API with `api` (src/lib/client/api.ts), whose
 * ApiError carries the status and the field errors of a problem+json answer.
 *
 *   export default withQueryClient(function OptionsBoard({ projectId }: Props) {
 *     const options = useQuery({ queryKey: ["options", projectId], queryFn: () => api<…>("GET", `/api/v1/projects/${projectId}/options`) });
 *     …
 *   });
 */
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { useState, type ComponentType } from "react";
import { ApiError } from "./api";

export function newQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        // 4xx answers will not change on a retry; a lost connection or a 503 may.
        retry: (count, err) => count < 2 && (!(err instanceof ApiError) || err.status === 0 || err.status >= 500),
      },
      mutations: { retry: false },
    },
  });
}

/** Wraps an island's root component in its own QueryClientProvider. */
export function withQueryClient<P extends object>(Component: ComponentType<P>): ComponentType<P> {
  function WithQueryClient(props: P) {
    const [client] = useState(newQueryClient);
    return (
      <QueryClientProvider client={client}>
        <Component {...props} />
      </QueryClientProvider>
    );
  }
  WithQueryClient.displayName = `WithQueryClient(${Component.displayName ?? Component.name})`;
  return WithQueryClient;
}

/** Whether an error is a stale write (409): the UI offers to reload. */
export const isConflict = (err: unknown): err is ApiError => err instanceof ApiError && err.status === 409;
