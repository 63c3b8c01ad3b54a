import { describe, expect, it } from "vitest";
import { ConfigError, configFromEnv, DEFAULT_DATABASE_URL } from "../src/config.js";

const SECRET = "s".repeat(40);

describe("configFromEnv", () => {
  it("configFromEnv fills the documented defaults", () => {
    const config = configFromEnv({ LOOPYARD_AUTH_SECRET: SECRET });
    expect(config).toMatchObject({ port: 4470, host: "127.0.0.1", publicUrl: "http://127.0.0.1:4470", databaseUrl: DEFAULT_DATABASE_URL });
    expect(config.webDist).toMatch(/packages[\\/]web[\\/]dist$/);
  });

  it("configFromEnv refuses a missing or short secret, a bad port and a bad public URL with a sentence naming the variable", () => {
    expect(() => configFromEnv({})).toThrow(/LOOPYARD_AUTH_SECRET/);
    expect(() => configFromEnv({ LOOPYARD_AUTH_SECRET: SECRET, PORT: "http" })).toThrow(/PORT/);
    expect(() => configFromEnv({ LOOPYARD_AUTH_SECRET: SECRET, LOOPYARD_PUBLIC_URL: "not a url" })).toThrow(ConfigError);
  });

  it("configFromEnv serves the API only when LOOPYARD_WEB_DIST is empty", () => {
    expect(configFromEnv({ LOOPYARD_AUTH_SECRET: SECRET, LOOPYARD_WEB_DIST: "" }).webDist).toBeNull();
  });
});
