import { createBrowserRouter } from "react-router";
import { RequireSession } from "./features/auth/require-session.js";
import { SignInPage } from "./features/auth/sign-in-page.js";
import { SignUpPage } from "./features/auth/sign-up-page.js";
import { PlantDetailPage } from "./features/plants/plant-detail-page.js";
import { PlantListPage } from "./features/plants/plant-list-page.js";
import { PlantNewPage } from "./features/plants/plant-new-page.js";
import { PlantRevisePage } from "./features/plants/plant-revise-page.js";
import { SweepDetailPage } from "./features/sweeps/sweep-detail-page.js";
import { SweepListPage } from "./features/sweeps/sweep-list-page.js";
import { SweepNewPage } from "./features/sweeps/sweep-new-page.js";
import { ComparisonDetailPage } from "./features/comparisons/comparison-detail-page.js";
import { ComparisonListPage } from "./features/comparisons/comparison-list-page.js";
import { ComparisonNewPage } from "./features/comparisons/comparison-new-page.js";
import { ComparisonsAcrossPage } from "./features/comparisons/comparisons-across-page.js";
import { DecisionDetailPage } from "./features/decisions/decision-detail-page.js";
import { DecisionListPage } from "./features/decisions/decision-list-page.js";
import { CreateWorkspacePage } from "./features/workspace/create-workspace-page.js";
import { NotFoundPage } from "./features/workspace/not-found-page.js";
import { RootRedirect } from "./features/workspace/root-redirect.js";
import { WorkspaceHomePage } from "./features/workspace/workspace-home-page.js";
import { WorkspaceShell } from "./features/workspace/workspace-shell.js";

/** Every page of Loopyard, one route each. Pages under RequireSession need a signed-in user. */
export const router = createBrowserRouter([
  { path: "/sign-in", element: <SignInPage /> },
  { path: "/sign-up", element: <SignUpPage /> },
  {
    element: <RequireSession />,
    children: [
      { index: true, element: <RootRedirect /> },
      { path: "workspaces/new", element: <CreateWorkspacePage /> },
      {
        path: "w/:slug",
        element: <WorkspaceShell />,
        children: [
          { index: true, element: <WorkspaceHomePage /> },
          { path: "plants", element: <PlantListPage /> },
          { path: "plants/new", element: <PlantNewPage /> },
          { path: "plants/:plantId", element: <PlantDetailPage /> },
          { path: "plants/:plantId/revise", element: <PlantRevisePage /> },
          { path: "sweeps", element: <SweepListPage /> },
          { path: "sweeps/new", element: <SweepNewPage /> },
          { path: "sweeps/:sweepId", element: <SweepDetailPage /> },
          { path: "comparisons", element: <ComparisonListPage /> },
          { path: "comparisons/new", element: <ComparisonNewPage /> },
          { path: "comparisons/across", element: <ComparisonsAcrossPage /> },
          { path: "comparisons/:comparisonId", element: <ComparisonDetailPage /> },
          { path: "decisions", element: <DecisionListPage /> },
          { path: "decisions/:decisionId", element: <DecisionDetailPage /> },
          { path: "*", element: <NotFoundPage inWorkspace /> },
        ],
      },
    ],
  },
  { path: "*", element: <NotFoundPage /> },
]);
