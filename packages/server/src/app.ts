import express, { type Express } from "express";
import { toNodeHandler } from "better-auth/node";
import type { AppConfig } from "./config.js";
import { CLIENT_ADDRESS_HEADER, createAuth, type Auth } from "./auth/auth.js";
import { authInputGuard } from "./auth/auth-input-guard.js";
import { loadCommonPasswords } from "./auth/common-passwords.js";
import { SESSION_COOKIE_PATTERN, SessionCache } from "./auth/session-cache.js";
import { forgetCachedSessions, requireSession } from "./auth/session-middleware.js";
import { createDatabase, type RootDatabase } from "./db/database.js";
import { apiNotFound, errorMiddleware } from "./http/error-middleware.js";
import { apiHeaders, securityHeaders } from "./http/security-headers.js";
import { jsonBodyGuard } from "./http/json-body-guard.js";
import { logger, requestLogger } from "./http/logger.js";
import { authPerIpLimit, DEFAULT_RATE_LIMITS, failedSignInLimit, mirrorRetryAfter } from "./http/rate-limits.js";
import { sameOriginGuard } from "./http/same-origin-guard.js";
import { candidateIndexGuard } from "./http/candidate-index-guard.js";
import { urlGuard } from "./http/url-guard.js";
import { BackgroundTasks } from "./http/background-tasks.js";
import { serveWebApp, webAppMissing } from "./http/web-app.js";
import { createCompute } from "./compute/compute.js";
import { meRoutes } from "./me/me-routes.js";
import { plantRoutes } from "./plants/plant-routes.js";
import { createSweepJobSystem, type SweepJobSystem } from "./jobs/sweep-job-system.js";
import { sweepRoutes } from "./sweeps/sweep-routes.js";
import { exportRoutes } from "./exports/export-routes.js";
import { DEFAULT_SWEEP_LIMITS } from "./sweeps/sweep-service.js";
import { workspaceRoutes } from "./workspaces/workspace-routes.js";
// Comparisons: criteria pitted against each other, as jobs of their own queues.
import { createComparisonJobSystem, type ComparisonJobSystem } from "./comparisons/comparison-job-system.js";
import { comparisonRoutes } from "./comparisons/comparison-routes.js";
// Mail: a queue of outgoing messages, sent over SMTP in the background; settings and the outbox.
import { createMailSystem, type MailSystem } from "./mail/mail-system.js";
// Decisions: proposals, a lead's approval, the audit trail and the record.
import { createDecisionMailer } from "./decisions/decision-mailer.js";
import { decisionPdfForMail } from "./decisions/decision-sheet.js";
import { decisionRoutes } from "./decisions/decision-routes.js";
import { decisionSettingsRoutes } from "./decisions/decision-settings-routes.js";
import type { DecisionDeps } from "./decisions/decision-service.js";

/** Largest JSON request body accepted (bigger bodies get a 413). */
export const JSON_BODY_LIMIT = "256kb";
/** Largest body of a sign-in, sign-up or account change: a name, an email and passwords. */
export const AUTH_BODY_LIMIT = "8kb";

/** The running application: an Express app plus what it holds open. */
export interface LoopyardApp {
  app: Express;
  auth: Auth;
  db: RootDatabase;
  /** Sweeps as pg-boss jobs, with the embedded worker unless turned off. */
  jobs: SweepJobSystem;
  /** Comparisons as pg-boss jobs, with the embedded comparison worker unless turned off. */
  comparisonJobs: ComparisonJobSystem;
  /** Outgoing mail: queue(message) and notify({userIds, kind, data}) from routes and services. */
  mail: MailSystem;
  /** Stops the embedded worker (running chunks finish) and pg-boss, then closes the database pool. */
  close(): Promise<void>;
}

/**
 * Builds the Loopyard HTTP application: better-auth under /api/auth, the JSON API under /api
 * (session and role checked on every route but /api/health), and the built web app when
 * `config.webDist` is given. Sweeps run as pg-boss jobs (an embedded worker takes them unless
 * turned off); what unfinished sweeps still need is enqueued at start-up.
 */
export function createApp(config: AppConfig): LoopyardApp {
  const database = createDatabase(config.databaseUrl);
  const { db } = database;
  const auth = createAuth(db, config);
  const background = new BackgroundTasks();
  const compute = createCompute();
  const jobs = createSweepJobSystem(db, config.databaseUrl, {
    embeddedWorker: config.embeddedWorker ?? true,
    resume: config.resumeSweeps ?? true,
    ...(config.workerThreads === undefined ? {} : { workerThreads: config.workerThreads }),
    ...(config.chunkExpireSeconds === undefined ? {} : { expireSeconds: config.chunkExpireSeconds }),
  });
  const comparisonJobs = createComparisonJobSystem(db, config.databaseUrl, {
    after: jobs.ready,
    embeddedWorker: config.embeddedWorker ?? true,
    resume: config.resumeSweeps ?? true,
    ...(config.workerThreads === undefined ? {} : { workerThreads: config.workerThreads }),
    ...(config.chunkExpireSeconds === undefined ? {} : { expireSeconds: config.chunkExpireSeconds }),
  });
  const mail = createMailSystem(db, config.databaseUrl, config.mail ?? null, comparisonJobs.ready);

  const sessions = new SessionCache();
  void loadCommonPasswords();
  const limits = config.rateLimits ?? DEFAULT_RATE_LIMITS;
  const publicOrigin = new URL(config.publicUrl).origin;
  const trustedOrigins = [publicOrigin, ...(config.extraTrustedOrigins ?? []).map((url) => new URL(url).origin)];

  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", false);
  app.use(requestLogger(config.requestLogLevel ?? "info"));
  app.use(securityHeaders(publicOrigin.startsWith("https://")));
  app.use(urlGuard);
  app.use("/api", apiHeaders, sameOriginGuard(trustedOrigins, SESSION_COOKIE_PATTERN));

  // better-auth, behind Loopyard's own limits and checks: rate limits per address and per account,
  // a small JSON body (parsed here; better-auth reads the parsed body), names and passwords checked.
  app.use(
    "/api/auth",
    (req, _res, next) => {
      delete req.headers[CLIENT_ADDRESS_HEADER];
      req.headers[CLIENT_ADDRESS_HEADER] = req.socket.remoteAddress ?? "";
      next();
    },
    mirrorRetryAfter,
    authPerIpLimit(limits.authPerIp),
    express.json({ limit: AUTH_BODY_LIMIT }),
    jsonBodyGuard,
    authInputGuard,
    forgetCachedSessions(sessions),
  );
  app.post("/api/auth/sign-in/email", failedSignInLimit(limits.failedSignInsPerAccount));
  app.all("/api/auth/*splat", toNodeHandler(auth));

  app.use(express.json({ limit: JSON_BODY_LIMIT }), jsonBodyGuard);
  app.get("/api/health", (_req, res) => {
    res.json({ ok: true });
  });

  app.use("/api", requireSession(auth, sessions));
  app.use("/api/me", meRoutes(db, sessions));
  app.use("/api/workspaces/:slug/plants", plantRoutes(db, compute));
  app.use("/api/workspaces/:slug", exportRoutes(db, database.pool));
  app.use("/api/workspaces/:slug/sweeps/:sweepId/candidates/:index", candidateIndexGuard);
  app.use(
    "/api/workspaces/:slug/sweeps",
    sweepRoutes(db, { start: (id) => jobs.start(id), cancel: (id) => jobs.cancel(id) }, config.limits ?? DEFAULT_SWEEP_LIMITS, background, compute),
  );
  app.use("/api/workspaces/:slug/comparisons", comparisonRoutes(db, comparisonJobs));
  // The approval mail carries the record's PDF.
  const decisionMailer = createDecisionMailer(db, mail, config.publicUrl, decisionPdfForMail({ db, compute }));
  const decisions: DecisionDeps = {
    db,
    compute,
    notify: (notice) => background.run(`mailing the ${notice.kind} notice of decision ${notice.decisionId}`, async () => void (await decisionMailer(notice))),
  };
  app.use("/api/workspaces/:slug/decisions", decisionRoutes(decisions));
  app.use("/api/workspaces/:slug/decision-settings", decisionSettingsRoutes(db));
  app.use("/api/workspaces", workspaceRoutes(db));
  app.use("/api", apiNotFound);

  if (config.webDist && !serveWebApp(app, config.webDist)) {
    logger.warn({ webDist: config.webDist }, "no web app (index.html missing); serving the API only. Build it with: npm run build");
    app.use(webAppMissing(config.webDist));
  }

  app.use(errorMiddleware(JSON_BODY_LIMIT));

  let closing: Promise<void> | null = null;
  return {
    app,
    auth,
    db,
    jobs,
    comparisonJobs,
    mail,
    close() {
      closing ??= (async () => {
        // Background tasks first: they may still queue mail (a decision's notices).
        await background.settle();
        await mail.close();
        await comparisonJobs.close();
        await jobs.close();
        await background.settle();
        await compute.close();
        await database.close();
      })();
      return closing;
    },
  };
}
