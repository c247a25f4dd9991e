export * from "./auth-schema";
export * from "./app-schema";
export * from "./library-schema";
export * from "./workspace-schema";
export * from "./deliverables-schema";
export * from "./organization-schema";
