/** The in-app path to return to after signing in; anything that is not a local path falls back to "/". */
export function safeNext(next: string | null): string {
  return next && next.startsWith("/") && !next.startsWith("//") ? next : "/";
}
