import type { QueryClient } from "@tanstack/react-query";
import { defaultAxes } from "../features/fronts/front-points.js";
import { frontQuery, pointsQuery } from "./use-fronts.js";
import { referencesQuery } from "./use-references.js";
import { isSweepActive, sweepQuery } from "./use-sweeps.js";

/** /w/:slug/sweeps/:sweepId (not /sweeps/new): the slug and sweep id, or null for any other path. */
export function sweepPagePath(pathname: string): { slug: string; sweepId: string } | null {
  const match = /^\/w\/([^/]+)\/sweeps\/([^/]+)\/?$/.exec(pathname);
  if (!match || match[2] === "new") return null;
  return { slug: decodeURIComponent(match[1] as string), sweepId: decodeURIComponent(match[2] as string) };
}

/**
 * For a sweep's page opened straight from its address: fetches the sweep at once, alongside the
 * session check and the workspace (which the page waits for before it asks), and when the sweep
 * has results, the cloud, the front and the references on the axes the page shows first. The page's
 * own queries then find these in the cache or in flight. Errors are left for the page to show: a
 * query that failed here is fetched again when the page mounts.
 */
export function prefetchSweepPage(queryClient: QueryClient, slug: string, sweepId: string): void {
  queryClient
    .fetchQuery(sweepQuery(slug, sweepId))
    .then((sweep) => {
      if (isSweepActive(sweep.status) || sweep.status === "failed" || sweep.done === 0) return;
      const { x, y } = defaultAxes(sweep.criteria);
      void queryClient.prefetchQuery(pointsQuery(slug, sweepId, x, y));
      void queryClient.prefetchQuery(frontQuery(slug, sweepId, x, y));
      void queryClient.prefetchQuery(referencesQuery(slug, sweepId));
    })
    .catch(() => undefined);
}
