/// <reference types="astro/client" />

declare namespace App {
  interface Locals {
    user: import("./lib/server/auth").AuthUser | null;
    session: import("./lib/server/auth").AuthSession | null;
  }
}
