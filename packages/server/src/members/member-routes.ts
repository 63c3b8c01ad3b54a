import { Router } from "express";
import { invitationInputSchema, memberRoleInputSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { parseBody, pathParam } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { inviteMember, listInvitations, resendInvitation, revokeInvitation, type InvitationDeps } from "./invitation-service.js";
import { changeMemberRole, listWorkspaceAudit, listWorkspaceMembers, removeMember } from "./member-service.js";

/** /api/workspaces/:slug/{members,invitations,audit}: the member list for everyone, changes for admins. */
export function memberRoutes(db: Database, deps: InvitationDeps): Router {
  const router = Router({ mergeParams: true });

  router.get("/members", memberOf(db, "viewer", "Reading the member list"), async (req, res) => {
    res.json(await listWorkspaceMembers(db, accessOf(req)));
  });

  router.patch("/members/:userId", memberOf(db, "admin", "Changing roles"), async (req, res) => {
    const input = parseBody(memberRoleInputSchema, req);
    res.json(await changeMemberRole(db, accessOf(req), pathParam(req.params.userId), input.role));
  });

  router.delete("/members/:userId", memberOf(db, "admin", "Removing members"), async (req, res) => {
    await removeMember(db, accessOf(req), pathParam(req.params.userId));
    res.status(204).end();
  });

  router.get("/invitations", memberOf(db, "admin", "Reading the pending invitations"), async (req, res) => {
    res.json(await listInvitations(db, accessOf(req), deps));
  });

  router.post("/invitations", memberOf(db, "admin", "Inviting people"), async (req, res) => {
    const input = parseBody(invitationInputSchema, req);
    res.status(201).json(await inviteMember(db, accessOf(req), input, deps));
  });

  router.post("/invitations/:invitationId/resend", memberOf(db, "admin", "Re-sending invitations"), async (req, res) => {
    res.json(await resendInvitation(db, accessOf(req), pathParam(req.params.invitationId), deps));
  });

  router.post("/invitations/:invitationId/revoke", memberOf(db, "admin", "Revoking invitations"), async (req, res) => {
    await revokeInvitation(db, accessOf(req), pathParam(req.params.invitationId), deps);
    res.status(204).end();
  });

  router.get("/audit", memberOf(db, "admin", "Reading the audit trail"), async (req, res) => {
    res.json(await listWorkspaceAudit(db, accessOf(req)));
  });

  return router;
}
