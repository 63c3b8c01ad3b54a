// Public surface of @loopyard/server. Every export is named here; types are kept apart.

export { AUTH_BODY_LIMIT, createApp, JSON_BODY_LIMIT } from "./app.js";
export { DEFAULT_RATE_LIMITS } from "./http/rate-limits.js";
export { configFromEnv, ConfigError, defaultMigrationsFolder, DEFAULT_DATABASE_URL, DEFAULT_HOST, DEFAULT_PORT } from "./config.js";
export { runMigrations } from "./db/migrate.js";
export { HttpError } from "./http/http-error.js";
export { routeTable } from "./http/route-table.js";
export { DEMO_FAMILY_SWEEP_NAME, DEMO_LOAD_SWEEP_NAME, DEMO_PASSWORD, DEMO_PLANTS, DEMO_SWEEPS, DEMO_USERS, DEMO_WORKSPACE, DEMO_SWEEP_NAME, seedDemo } from "./seed/demo-seed.js";

export type { AppConfig, ServerConfig } from "./config.js";
export type { RateLimits, RateLimitRule } from "./http/rate-limits.js";
export type { RouteEntry } from "./http/route-table.js";
export type { LoopyardApp } from "./app.js";
export type { SeedReport } from "./seed/demo-seed.js";
