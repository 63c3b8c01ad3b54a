import { hasRole } from "@loopyard/core";
import { useMe } from "../../api/use-me.js";
import { useAuditTrail, useInvitations, useMembers } from "../../api/use-members.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { RoleNote } from "../../components/role-note.js";
import { Section } from "../../components/section.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { AuditTrail } from "./audit-trail.js";
import { InviteForm } from "./invite-form.js";
import { MemberTable } from "./member-table.js";
import { PendingInvitations } from "./pending-invitations.js";

/** /w/:slug/members — everyone reads the member list; admins invite, change roles, remove and read the audit trail. */
export function MembersPage() {
  const { slug, workspace, role } = useWorkspaceRole();
  const me = useMe();
  const isAdmin = role !== undefined && hasRole(role, "admin");
  const members = useMembers(slug);
  const invitations = useInvitations(slug, isAdmin);
  const audit = useAuditTrail(slug, isAdmin);
  const name = workspace.data?.workspace.name;

  return (
    <div data-testid="members-page" className="space-y-6">
      <PageHeader
        title="Members"
        subtitle={<>Who works in {name ?? "this workspace"} and with which role. People join by accepting a mailed invitation.</>}
      />
      {!isAdmin && role ? <RoleNote sentence={roleSentence("Inviting people and changing roles", "admin", name, role)} /> : null}

      <Section title={`Members${members.data ? ` (${members.data.members.length})` : ""}`} testId="members-section">
        {members.isPending ? (
          <Loading />
        ) : members.isError ? (
          <ErrorNote error={members.error} title="Could not load the members" />
        ) : (
          <MemberTable slug={slug} members={members.data.members} adminCount={members.data.adminCount} canManage={isAdmin} myId={me.data?.user.id ?? ""} />
        )}
      </Section>

      {isAdmin ? (
        <>
          <Section title="Invite someone" testId="invite-section">
            <InviteForm slug={slug} />
          </Section>
          <Section title={`Pending invitations${invitations.data ? ` (${invitations.data.length})` : ""}`} testId="invitations-section">
            {invitations.isPending ? (
              <Loading />
            ) : invitations.isError ? (
              <ErrorNote error={invitations.error} title="Could not load the invitations" />
            ) : (
              <PendingInvitations slug={slug} invitations={invitations.data} />
            )}
          </Section>
          <Section title="Audit trail" aside="every invitation, answer, role change and removal; entries are never changed" testId="audit-section">
            {audit.isPending ? <Loading /> : audit.isError ? <ErrorNote error={audit.error} title="Could not load the audit trail" /> : <AuditTrail events={audit.data} />}
          </Section>
        </>
      ) : null}
    </div>
  );
}
