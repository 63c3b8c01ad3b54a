// @loopyard/core/api — what the server and the web app share about the app's pages, apart from the
// engine's main entry (which knows no page paths).
export { isDrawingPage } from "./page-paths.js";
