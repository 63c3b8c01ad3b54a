/**
 * The secret of a mailed link, read from the page's hash ("/invitation#<token>"): the fragment never
 * reaches the server, so no request log holds it. Empty when there is none.
 */
export function secretFromHash(hash: string): string {
  const raw = hash.startsWith("#") ? hash.slice(1) : hash;
  try {
    return decodeURIComponent(raw).trim();
  } catch {
    return raw.trim();
  }
}

/** The in-app path to come back to a page with its secret after signing in or up, e.g. "/invitation#abc". */
export function pathWithSecret(page: string, secret: string): string {
  return `/${page}#${encodeURIComponent(secret)}`;
}
