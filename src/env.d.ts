/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    user: import("./lib/server/auth").AuthUser | null;
    session: import("./lib/server/auth").AuthSession | null;
    /** The API key the request authenticated with (`Authorization: Bearer …`), or null/absent for a session. */
    apiKey?: import("./lib/server/services/api-keys").ApiKeyPrincipal | null;
  }
}
