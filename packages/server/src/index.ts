// Public surface of @loopyard/server. Every export is named here; types are kept apart.

export { createApp, JSON_BODY_LIMIT } from "./app.js";
export { configFromEnv, ConfigError, defaultMigrationsFolder, DEFAULT_DATABASE_URL, DEFAULT_HOST, DEFAULT_PORT } from "./config.js";
export { runMigrations } from "./db/migrate.js";
export { HttpError } from "./http/http-error.js";
export { DEMO_LOAD_SWEEP_NAME, DEMO_PASSWORD, DEMO_PLANTS, DEMO_SWEEPS, DEMO_USERS, DEMO_WORKSPACE, DEMO_SWEEP_NAME, seedDemo } from "./seed/demo-seed.js";

export type { AppConfig, ServerConfig } from "./config.js";
export type { LoopyardApp } from "./app.js";
export type { SeedReport } from "./seed/demo-seed.js";
