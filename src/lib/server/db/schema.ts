export * from "./auth-schema";
export * from "./app-schema";
