/** Paths under /api that take a multipart/form-data body (a file upload) besides JSON: the step-test upload. */
export const MULTIPART_PATHS: readonly RegExp[] = [/^\/workspaces\/[^/]+\/step-tests\/?$/];
