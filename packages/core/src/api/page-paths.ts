/**
 * The web app's pages that draw charts on opening: a sweep's page (its front) and a plant's page (its
 * step response), e.g. /w/halvard-thermal/sweeps/3f2c…, not /w/…/sweeps/new. The web app starts the
 * plotting bundle at once on these; the server names the bundle in their HTML so the browser fetches
 * it alongside the app's own script.
 */
export function isDrawingPage(pathname: string): boolean {
  const match = /^\/w\/[^/]+\/(sweeps|plants)\/([^/]+)\/?$/.exec(pathname);
  return match !== null && match[2] !== "new";
}
