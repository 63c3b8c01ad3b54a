import "./zod-jitless.js";
import "@fontsource/inter/400.css";
import "@fontsource/inter/500.css";
import "@fontsource/inter/600.css";
import "@fontsource/jetbrains-mono/400.css";
import "@fontsource/jetbrains-mono/500.css";
import "./styles.css";

import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { QueryClientProvider } from "@tanstack/react-query";
import { RouterProvider } from "react-router/dom";
import { isDrawingPage } from "@loopyard/core/api";
import { createQueryClient } from "./api/query-client.js";
import { router } from "./router.js";
import { preloadPlot } from "./components/charts/lazy-plot.js";
import { prefetchSweepPage, sweepPagePath } from "./api/sweep-page-prefetch.js";

const queryClient = createQueryClient();

// Opened straight on a page that draws (a sweep's or a plant's): start the plotting bundle now, while
// the app signs in and fetches its data, instead of once the page has mounted. A sweep's page also
// starts fetching its data now (see prefetchSweepPage).
if (isDrawingPage(window.location.pathname)) void preloadPlot();
const sweepPage = sweepPagePath(window.location.pathname);
if (sweepPage) prefetchSweepPage(queryClient, sweepPage.slug, sweepPage.sweepId);

const root = document.getElementById("root");
if (!root) throw new Error("index.html has no #root element");

createRoot(root).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
