import { createBrowserRouter } from "react-router";
import { RequireSession } from "./features/auth/require-session.js";
import { SignInPage } from "./features/auth/sign-in-page.js";
import { SignUpPage } from "./features/auth/sign-up-page.js";
import { ForgotPasswordPage } from "./features/auth/forgot-password-page.js";
import { ResetPasswordPage } from "./features/auth/reset-password-page.js";
import { VerifyEmailPage } from "./features/auth/verify-email-page.js";
import { InvitationPage } from "./features/auth/invitation-page.js";
import { MembersPage } from "./features/members/members-page.js";
import { PlantRefitPage } from "./features/identification/plant-refit-page.js";
import { StepTestFitPage } from "./features/identification/step-test-fit-page.js";
import { StepTestUploadPage } from "./features/identification/step-test-upload-page.js";
import { PlantDetailPage } from "./features/plants/plant-detail-page.js";
import { PlantListPage } from "./features/plants/plant-list-page.js";
import { PlantNewPage } from "./features/plants/plant-new-page.js";
import { PlantRevisePage } from "./features/plants/plant-revise-page.js";
import { FamilyDetailPage } from "./features/families/family-detail-page.js";
import { FamilyEditPage } from "./features/families/family-edit-page.js";
import { FamilyListPage } from "./features/families/family-list-page.js";
import { LibraryImportPage } from "./features/library/library-import-page.js";
import { SweepDetailPage } from "./features/sweeps/sweep-detail-page.js";
import { SweepListPage } from "./features/sweeps/sweep-list-page.js";
import { SweepNewPage } from "./features/sweeps/sweep-new-page.js";
import { ComparisonDetailPage } from "./features/comparisons/comparison-detail-page.js";
import { ComparisonListPage } from "./features/comparisons/comparison-list-page.js";
import { ComparisonNewPage } from "./features/comparisons/comparison-new-page.js";
import { ComparisonsAcrossPage } from "./features/comparisons/comparisons-across-page.js";
import { NotificationSettingsPage } from "./features/mail/notification-settings-page.js";
import { OutboxPage } from "./features/mail/outbox-page.js";
import { DecisionDetailPage } from "./features/decisions/decision-detail-page.js";
import { DecisionListPage } from "./features/decisions/decision-list-page.js";
import { CreateWorkspacePage } from "./features/workspace/create-workspace-page.js";
import { NotFoundPage } from "./features/workspace/not-found-page.js";
import { RootRedirect } from "./features/workspace/root-redirect.js";
import { WorkspaceHomePage } from "./features/workspace/workspace-home-page.js";
import { WorkspaceShell } from "./features/workspace/workspace-shell.js";
import { CandidateSheetPage } from "./features/deployment/candidate-sheet-page.js";

/** Every page of Loopyard, one route each. Pages under RequireSession need a signed-in user. */
export const router = createBrowserRouter([
  { path: "/sign-in", element: <SignInPage /> },
  { path: "/sign-up", element: <SignUpPage /> },
  // Pages the account mails link to; their secret is in the hash. The invitation page asks to sign in itself.
  { path: "/forgot-password", element: <ForgotPasswordPage /> },
  { path: "/reset-password", element: <ResetPasswordPage /> },
  { path: "/verify-email", element: <VerifyEmailPage /> },
  { path: "/invitation", element: <InvitationPage /> },
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
          { path: "plants/identify", element: <StepTestUploadPage /> },
          { path: "plants/identify/:stepTestId", element: <StepTestFitPage /> },
          { path: "plants/:plantId", element: <PlantDetailPage /> },
          { path: "plants/:plantId/refit", element: <PlantRefitPage /> },
          { path: "plants/:plantId/revise", element: <PlantRevisePage /> },
          { path: "library/import", element: <LibraryImportPage /> },
          { path: "families", element: <FamilyListPage /> },
          { path: "families/new", element: <FamilyEditPage /> },
          { path: "families/:familyId", element: <FamilyDetailPage /> },
          { path: "families/:familyId/revise", element: <FamilyEditPage /> },
          { path: "sweeps", element: <SweepListPage /> },
          { path: "sweeps/new", element: <SweepNewPage /> },
          { path: "sweeps/:sweepId", element: <SweepDetailPage /> },
          { path: "sweeps/:sweepId/candidates/:index/sheet", element: <CandidateSheetPage /> },
          { path: "comparisons", element: <ComparisonListPage /> },
          { path: "comparisons/new", element: <ComparisonNewPage /> },
          { path: "comparisons/across", element: <ComparisonsAcrossPage /> },
          { path: "comparisons/:comparisonId", element: <ComparisonDetailPage /> },
          { path: "members", element: <MembersPage /> },
          { path: "outbox", element: <OutboxPage /> },
          { path: "notifications", element: <NotificationSettingsPage /> },
          { path: "decisions", element: <DecisionListPage /> },
          { path: "decisions/:decisionId", element: <DecisionDetailPage /> },
          { path: "*", element: <NotFoundPage inWorkspace /> },
        ],
      },
    ],
  },
  { path: "*", element: <NotFoundPage /> },
]);
