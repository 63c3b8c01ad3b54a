/**
 * Proposals and decisions over real HTTP (issue 12): the whole flow (propose → the proposal mail
 * to each lead → return with a comment → revise → approve → frozen, the previous decision
 * superseded, the audit trail complete), the four-eyes rule and its workspace setting, the record
 * as JSON (round trip through the zod schema, an unknown version refused), proposals from a
 * comparison pick and from a baseline, and what pins a decision's sweep and revisions.
 *
 * References: the four-eyes rule (a change is approved by someone other than its author) is
 * common practice in regulated engineering change control; the record's scores are checked
 * against what the study stored (the sweep's candidate, the comparison's pick, the references'
 * baseline), the same numbers through another path.
 */
import { mkdtemp, readdir, readFile, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { simpleParser } from "mailparser";
import { decisionRecordSchema, readDecisionRecord } from "@loopyard/core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startMailSink, type MailSink } from "../../packages/server/src/index.js";
import { createDatabase } from "../../packages/server/src/db/database.js";
import { assertNotPinnedByDecision } from "../../packages/server/src/decisions/decision-pins.js";
import { pdfText } from "../../packages/server/test/exports/pdf-text-check.js";
import { startTestServer, type TestServer } from "../support/test-server.js";
import { signedInClient, type ApiClient } from "./api-client.js";
import { lagFamily, smallComparison, waitForComparison } from "./comparison-fixtures.js";
import { waitForSweep, workspaceWithTeam } from "./fixtures.js";

let server: TestServer;
let sink: MailSink;
let mailFolder: string;
let team: Awaited<ReturnType<typeof workspaceWithTeam>>;
let leadA: { client: ApiClient; user: { name: string; email: string } };
let leadB: { client: ApiClient; user: { name: string; email: string } };
let revisions: string[];
let sweepId: string;
let base: string;

/** A 3 × 3 PI grid on the three-variant lag family, 8 s at 10 ms, worst case: nine candidates. */
function familySweep(name: string) {
  return {
    name,
    plantRevisionId: revisions[0],
    family: { name: "Lag bench family", variants: revisions.map((plantRevisionId, i) => ({ plantRevisionId, label: `gain ${["1", "1.4", "0.7"][i]}` })) },
    structure: "pi",
    ranges: { kp: { min: 0.5, max: 2, count: 3 }, ki: { min: 0.2, max: 1, count: 3 } },
    scenario: { kind: "setpoint-step", horizon: 8, dt: 0.01 },
    criteria: ["iae", "ise", "effort", "overshoot"],
  };
}

function proposal(title: string, candidateIndex: number) {
  return { title, rationale: `Lowest IAE on the worst variant among the stable candidates (${title}).`, source: { kind: "sweep-candidate", sweepId, candidateIndex } };
}

/** The .eml files the sink received for `address` (parsed), waiting up to `timeoutMs` for at least `atLeast` of them. */
async function mailsTo(address: string, atLeast: number, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const names = (await readdir(mailFolder)).filter((n) => n.endsWith(".eml")).sort();
    const parsed = await Promise.all(names.map(async (n) => simpleParser(await readFile(path.join(mailFolder, n)))));
    const mine = parsed.filter((m) => {
      const to = Array.isArray(m.to) ? m.to : m.to ? [m.to] : [];
      return to.some((t) => t.value.some((v) => v.address?.toLowerCase() === address.toLowerCase()));
    });
    if (mine.length >= atLeast || Date.now() > deadline) return mine;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

beforeAll(async () => {
  mailFolder = await mkdtemp(path.join(tmpdir(), "loopyard-decision-mail-"));
  sink = await startMailSink({ port: 0, folder: mailFolder });
  server = await startTestServer({
    mail: { smtpUrl: sink.url, from: "Loopyard <loopyard@localhost>", sink: { host: sink.host, port: sink.port, folder: mailFolder }, retry: { retryLimit: 3, retryDelaySeconds: 1 } },
  });
  team = await workspaceWithTeam(server.url, "Decisions");
  base = `/api/workspaces/${team.slug}`;
  leadA = await signedInClient(server.url, "Decisions lead Astrid");
  leadB = await signedInClient(server.url, "Decisions lead Bram");
  for (const lead of [leadA, leadB]) expect((await team.admin.post(`${base}/members`, { email: lead.user.email, role: "lead" })).status).toBe(201);
  revisions = await lagFamily(team.engineer, team.slug, "Decisions");
  const sweep = await team.engineer.post(`${base}/sweeps`, familySweep("Decisions PI grid"));
  expect(sweep.status, JSON.stringify(sweep.body)).toBe(201);
  sweepId = sweep.body.id;
  expect((await waitForSweep(team.viewer, team.slug, sweepId)).status).toBe("finished");
}, 120_000);

afterAll(async () => {
  await server?.close();
  await sink?.close();
  if (mailFolder) await rm(mailFolder, { recursive: true, force: true });
});

describe("decisions over HTTP", () => {
  it("propose → mail to each lead → return → revise → approve → frozen; the previous decision superseded; the audit trail complete", async () => {
    // An earlier approved decision of the same family, to be superseded.
    const first = await team.engineer.post(`${base}/decisions`, proposal("PI for the lag bench, first take", 0));
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect((await leadB.client.post(`${base}/decisions/${first.body.id}/approve`)).status).toBe(200);

    // Propose: the record holds the candidate's stored scores on every variant.
    const proposed = await team.engineer.post(`${base}/decisions`, proposal("PI for the lag bench", 4));
    expect(proposed.status, JSON.stringify(proposed.body)).toBe(201);
    const id: string = proposed.body.id;
    expect(proposed.body.state).toBe("proposed");
    expect(proposed.body.family.key).toBe(first.body.family.key);
    const candidate = await team.viewer.get(`${base}/sweeps/${sweepId}/candidates/4`);
    // Reference: the sweep's stored candidate (GET …/candidates/4), the same numbers through another path.
    expect(proposed.body.record.scores.variants.map((v: { scores: unknown }) => v.scores)).toEqual(candidate.body.variantScores);
    expect(proposed.body.record.scores.aggregate).toEqual(candidate.body.scores);
    expect(proposed.body.record.family.variants.map((v: { revisionId: string }) => v.revisionId)).toEqual(revisions);
    expect(proposed.body.record.structure.parameters.kp).toBe(candidate.body.params[0]);

    // The proposal mail reaches each lead, with a link to the decision's page.
    for (const lead of [leadA, leadB]) {
      const mails = (await mailsTo(lead.user.email, 2)).filter((m) => m.subject === "Proposal waiting: PI for the lag bench");
      expect(mails.length, `proposal mails to ${lead.user.email}`).toBe(1);
      const mail = mails[0]!;
      const link = `${server.url}/w/${team.slug}/decisions/${id}`;
      expect(mail.headers.get("x-loopyard-link")).toBe(link);
      expect(mail.text).toContain(link);
      expect(mail.html || "").toContain(link);
      // The link's decision is the one proposed: its path ends in the id the API knows.
      const linked = new URL(link).pathname.split("/").pop();
      expect((await lead.client.get(`${base}/decisions/${linked}`)).body.title).toBe("PI for the lag bench");
    }
    expect((await mailsTo(team.credentials.engineer.email, 0)).filter((m) => m.subject?.startsWith("Proposal waiting"))).toHaveLength(0);

    // Waiting for leadA: the proposal; the engineer has nothing returned yet.
    const waiting = await leadA.client.get(`${base}/decisions/waiting`);
    expect(waiting.body.toApprove.map((d: { id: string }) => d.id)).toContain(id);

    // Return with a comment.
    const returned = await leadA.client.post(`${base}/decisions/${id}/return`, { comment: "Candidate 4 overshoots on the 1.4 plate; take one with less overshoot." });
    expect(returned.status, JSON.stringify(returned.body)).toBe(200);
    expect(returned.body.state).toBe("returned");
    expect((await team.engineer.get(`${base}/decisions/waiting`)).body.returnedToMe.map((d: { id: string }) => d.id)).toEqual([id]);
    const returnedMails = await mailsTo(team.credentials.engineer.email, 2);
    expect(returnedMails.some((m) => m.subject === "Returned: PI for the lag bench" && (m.text ?? "").includes("less overshoot"))).toBe(true);

    // Only the proposer revises; then it is proposed again.
    expect((await leadA.client.request("PUT", `${base}/decisions/${id}`, { json: proposal("PI for the lag bench, gentler", 3) })).status).toBe(403);
    const revised = await team.engineer.request("PUT", `${base}/decisions/${id}`, { json: proposal("PI for the lag bench, gentler", 3) });
    expect(revised.status, JSON.stringify(revised.body)).toBe(200);
    expect(revised.body.state).toBe("proposed");
    expect(revised.body.source.candidateIndex).toBe(3);
    expect(revised.body.can.canRevise).toBe(false);

    // Approve: frozen, and the family's first decision superseded.
    const approved = await leadA.client.post(`${base}/decisions/${id}/approve`);
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect(approved.body.state).toBe("approved");
    expect(approved.body.approvedBy.email).toBe(leadA.user.email);
    expect(approved.body.supersedes).toBe(first.body.id);
    const previous = await team.viewer.get(`${base}/decisions/${first.body.id}`);
    expect(previous.body.state).toBe("superseded");
    expect(previous.body.supersededBy).toBe(id);
    expect(previous.body.record.supersededBy).toBe(id);

    // Frozen: every change answers 409 with a sentence, for the approved and the superseded one.
    for (const target of [id, first.body.id]) {
      const attempts = [
        await team.engineer.request("PUT", `${base}/decisions/${target}`, { json: proposal("Changed afterwards", 2) }),
        await leadB.client.post(`${base}/decisions/${target}/approve`),
        await leadB.client.post(`${base}/decisions/${target}/return`, { comment: "Too late." }),
        await team.engineer.post(`${base}/decisions/${target}/comments`, { comment: "One more thought." }),
        await team.engineer.post(`${base}/decisions/${target}/withdraw`),
      ];
      for (const attempt of attempts) {
        expect(attempt.status).toBe(409);
        expect(attempt.body.error.message).toContain("frozen: nothing in it can change");
      }
    }
    const detail = await team.viewer.get(`${base}/decisions/${id}`);
    expect(detail.body.can).toEqual({ canApprove: false, canReturn: false, canComment: false, canWithdraw: false, canRevise: false, approveBlockedBecause: null });

    // The audit trail: every state change and comment with who and when, in order.
    const trail = detail.body.events.map((e: { kind: string; actor: { email: string }; fromState: string | null; toState: string | null }) => [e.kind, e.actor.email, e.fromState, e.toState]);
    expect(trail).toEqual([
      ["proposed", team.credentials.engineer.email, null, "proposed"],
      ["returned", leadA.user.email, "proposed", "returned"],
      ["revised", team.credentials.engineer.email, "returned", "proposed"],
      ["approved", leadA.user.email, "proposed", "approved"],
    ]);
    expect(detail.body.events[2].revised).toEqual({ title: "PI for the lag bench, gentler", rationale: true, source: { kind: "sweep-candidate", sweepId, candidateIndex: 3 } });
    expect(detail.body.comments.map((c: { kind: string; text: string }) => [c.kind, c.text])).toEqual([["return", "Candidate 4 overshoots on the 1.4 plate; take one with less overshoot."]]);
    for (const event of detail.body.events) expect(Number.isNaN(Date.parse(event.at))).toBe(false);
    expect(previous.body.events.map((e: { kind: string }) => e.kind)).toEqual(["proposed", "approved", "superseded"]);

    // The record as a PDF: it starts with %PDF and names the parameters and their values.
    const pdf = await team.viewer.getBytes(`${base}/decisions/${id}/record.pdf`, "application/pdf");
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toContain("application/pdf");
    expect(pdf.headers.get("content-disposition")).toContain("decision-pi-for-the-lag-bench-gentler.pdf");
    const bytes = Buffer.from(pdf.bytes);
    expect(bytes.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    const text = pdfText(bytes);
    expect(text).toContain("PI for the lag bench, gentler");
    for (const name of ["kp", "ki"]) expect(text).toContain(name);

    // The approval mail reaches the proposer, with the record's PDF attached.
    const approvalMails = await mailsTo(team.credentials.engineer.email, 3);
    const approval = approvalMails.filter((m) => m.subject === "Approved: PI for the lag bench, gentler");
    expect(approval).toHaveLength(1);
    expect(approval[0]!.attachments.map((a) => [a.filename, a.contentType])).toEqual([["decision-pi-for-the-lag-bench-gentler.pdf", "application/pdf"]]);
    expect(approval[0]!.attachments[0]!.content.subarray(0, 5).toString("latin1")).toBe("%PDF-");

    // The deployment sheet of the decision at 100 Hz, Tustin, Q15: the same as the candidate's own sheet
    // (reference: GET …/sweeps/:id/candidates/3/sheet, the same design through the sweep's path).
    const query = "?sampleTime=0.01&method=tustin&format=q15";
    const sheet = await team.viewer.get(`${base}/decisions/${id}/sheet${query}`);
    expect(sheet.status, JSON.stringify(sheet.body)).toBe(200);
    const candidateSheet = await team.viewer.get(`${base}/sweeps/${sweepId}/candidates/3/sheet${query}`);
    expect(candidateSheet.status).toBe(200);
    expect(sheet.body.discrete.coefficients).toEqual(candidateSheet.body.discrete.coefficients);
    expect(sheet.body.variants.map((v: { label: string }) => v.label)).toEqual(["gain 1", "gain 1.4", "gain 0.7"]);
    const noRate = await team.viewer.get(`${base}/decisions/${id}/sheet`);
    expect(noRate.status).toBe(400);
    expect(noRate.body.error.field).toBe("sampleTime");

    // Lists: by state and by family.
    const approvedList = await team.viewer.get(`${base}/decisions?state=approved`);
    expect(approvedList.body.map((d: { id: string }) => d.id)).toEqual([id]);
    const familyList = await team.viewer.get(`${base}/decisions?family=${encodeURIComponent(approved.body.family.key)}&state=superseded`);
    expect(familyList.body.map((d: { id: string }) => d.id)).toEqual([first.body.id]);
    const badState = await team.viewer.get(`${base}/decisions?state=decided`);
    expect(badState.status).toBe(400);
    expect(badState.body.error.field).toBe("state");

    // What an approved decision rests on cannot be deleted: the refusal names the decision.
    const database = createDatabase(process.env.DATABASE_URL!, { max: 1 });
    try {
      await expect(assertNotPinnedByDecision(database.db, { sweepId }, "This sweep")).rejects.toMatchObject({ status: 409, message: expect.stringContaining("“PI for the lag bench, gentler” (approved)") });
      await expect(assertNotPinnedByDecision(database.db, { revisionIds: [revisions[1]!] }, "This plant")).rejects.toMatchObject({ status: 409 });
      // The database refuses it too (no cascade from a sweep to the decisions resting on it).
      await expect(database.pool.query("delete from sweep where id = $1", [sweepId])).rejects.toMatchObject({ code: "23503" });
    } finally {
      await database.close();
    }
  }, 120_000);

  it("four-eyes: a lead's own proposal is refused to them until an admin allows self-approval", async () => {
    const own = await leadA.client.post(`${base}/decisions`, proposal("Lead's own PI", 5));
    expect(own.status, JSON.stringify(own.body)).toBe(201);
    expect(own.body.can.canApprove).toBe(false);
    expect(own.body.can.approveBlockedBecause).toContain("four-eyes rule");
    const refused = await leadA.client.post(`${base}/decisions/${own.body.id}/approve`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toContain("a lead does not approve their own proposal (four-eyes rule)");
    expect((await leadA.client.get(`${base}/decisions/waiting`)).body.toApprove.map((d: { id: string }) => d.id)).not.toContain(own.body.id);
    expect((await leadB.client.get(`${base}/decisions/waiting`)).body.toApprove.map((d: { id: string }) => d.id)).toContain(own.body.id);
    // Engineers and viewers neither approve nor change the setting.
    const engineerApproves = await team.engineer.post(`${base}/decisions/${own.body.id}/approve`);
    expect(engineerApproves.status).toBe(403);
    expect(engineerApproves.body.error.message).toContain("Approving decisions needs the lead role or higher");
    expect((await leadA.client.request("PUT", `${base}/decision-settings`, { json: { allowSelfApproval: true } })).status).toBe(403);
    expect((await team.viewer.get(`${base}/decision-settings`)).body.allowSelfApproval).toBe(false);
    // The admin allows it; now the lead approves their own proposal.
    const allowed = await team.admin.request("PUT", `${base}/decision-settings`, { json: { allowSelfApproval: true } });
    expect(allowed.status).toBe(200);
    expect(allowed.body.allowSelfApproval).toBe(true);
    const approved = await leadA.client.post(`${base}/decisions/${own.body.id}/approve`);
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect(approved.body.state).toBe("approved");
    expect((await team.admin.request("PUT", `${base}/decision-settings`, { json: { allowSelfApproval: false } })).body.allowSelfApproval).toBe(false);
  }, 60_000);

  it("record.json round-trips through the zod schema; an unknown version is refused naming the field", async () => {
    const list = await team.viewer.get(`${base}/decisions?state=approved`);
    const id = list.body[0].id as string;
    const response = await team.viewer.get(`${base}/decisions/${id}/record.json`);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-disposition")).toContain(`decision-${id}.json`);
    const record = response.body;
    expect(record.format).toBe("loopyard.decision-record");
    expect(record.version).toBe(1);
    const read = readDecisionRecord(record);
    expect(read.ok, JSON.stringify(read)).toBe(true);
    // Round trip: parsing changes nothing, and the parsed record serialises to the same JSON.
    expect(decisionRecordSchema.parse(record)).toEqual(record);
    expect(JSON.parse(JSON.stringify(decisionRecordSchema.parse(JSON.parse(JSON.stringify(record)))))).toEqual(record);
    expect(record.caution).toContain("Simulated designs are not validated designs");
    expect(record.family.variants).toHaveLength(3);
    for (const variant of record.family.variants) expect(variant.model.kind).toBe("transfer-function");

    const later = readDecisionRecord({ ...record, version: 2 });
    expect(later).toEqual({ ok: false, issue: { field: "version", message: "version: this is version 2 of loopyard.decision-record; this Loopyard reads version 1 only" } });
    const missing = readDecisionRecord({ ...record, scores: undefined });
    expect(missing.ok).toBe(false);
    if (!missing.ok) expect(missing.issue.field).toBe("scores");
  }, 30_000);

  it("a comparison's pick and a tuning rule's baseline can be proposed; their records carry their study's own scores", async () => {
    const comparison = await team.engineer.post(`${base}/comparisons`, smallComparison("Decisions comparison", revisions));
    expect(comparison.status, JSON.stringify(comparison.body)).toBe(201);
    expect((await waitForComparison(team.viewer, team.slug, comparison.body.id)).status).toBe("finished");
    const pick = await team.engineer.post(`${base}/decisions`, {
      title: "ITAE pick for the lag bench",
      rationale: "ITAE's pick keeps every plate within Ms ≤ 1.8 with the least regret on overshoot.",
      source: { kind: "comparison-pick", comparisonId: comparison.body.id, contender: "itae" },
    });
    expect(pick.status, JSON.stringify(pick.body)).toBe(201);
    const result = await team.viewer.get(`${base}/comparisons/${comparison.body.id}/result`);
    const stored = result.body.picks.find((p: { contender: string }) => p.contender === "itae");
    const row = result.body.crossScore.rows.indexOf("itae");
    const record = pick.body.record;
    // Reference: the comparison's stored pick and cross-score row (GET …/result).
    expect(record.comparison.values).toEqual(result.body.crossScore.values[row]);
    expect(record.comparison.perVariant).toEqual(stored.perVariant);
    expect(record.criteria).toEqual(stored.base.criteria);
    expect(record.scores.variants.map((v: { scores: unknown }) => v.scores)).toEqual(stored.base.scores);
    for (const [name, value] of Object.entries(stored.params as Record<string, number>)) expect(record.structure.parameters[name]).toBeCloseTo(value, 12);
    expect(record.sweep).toBeNull();
    expect(pick.body.family.key).not.toBe("");

    const missing = await team.engineer.post(`${base}/decisions`, { title: "No such pick", rationale: "x", source: { kind: "comparison-pick", comparisonId: comparison.body.id, contender: "itse" } });
    expect(missing.status).toBe(400);
    expect(missing.body.error.field).toBe("source.contender");

    const baseline = await team.engineer.post(`${base}/decisions`, {
      title: "SIMC PI for the lag bench",
      rationale: "The published rule, as a fallback the firmware team knows.",
      source: { kind: "baseline", sweepId, rule: "simc", variant: "pi" },
    });
    expect(baseline.status, JSON.stringify(baseline.body)).toBe(201);
    const references = await team.viewer.get(`${base}/sweeps/${sweepId}/references`);
    const simc = references.body.baselines.find((b: { rule: string; variant: string }) => b.rule === "simc" && b.variant === "pi");
    // Reference: the same rule scored beside the front (core scoreFamilyBaselines, the sweep's references).
    expect(baseline.body.record.scores.aggregate).toHaveLength(simc.scores.length);
    baseline.body.record.scores.aggregate.forEach((value: number, c: number) => expect(value).toBeCloseTo(simc.scores[c], 10));
    for (const name of ["kp", "ki", "kd", "tf"]) expect(baseline.body.record.structure.parameters[name]).toBeCloseTo(simc.params[name], 12);
    expect(baseline.body.record.structure.tuned).toEqual([]);
  }, 150_000);

  it("bad bodies are 400s naming the field; unknown ids 404", async () => {
    const cases: [unknown, string][] = [
      [{ title: "", rationale: "r", source: { kind: "sweep-candidate", sweepId, candidateIndex: 0 } }, "title"],
      [{ title: "t", rationale: "r", source: { kind: "sweep-candidate", sweepId, candidateIndex: 999 } }, "source.candidateIndex"],
      [{ title: "t", rationale: "r", source: { kind: "sweep-candidate", sweepId: "00000000-0000-4000-8000-000000000000", candidateIndex: 0 } }, "source.sweepId"],
      [{ title: "t", rationale: "r", source: { kind: "baseline", sweepId, rule: "simc", variant: "p" } }, "source.rule"],
      [{ title: "t", rationale: "r", source: { kind: "guess" } }, "source.kind"],
    ];
    for (const [body, field] of cases) {
      const response = await team.engineer.post(`${base}/decisions`, body);
      expect(response.status, JSON.stringify(response.body)).toBe(400);
      expect(response.body.error.field).toBe(field);
    }
    const list = await team.viewer.get(`${base}/decisions?state=proposed`);
    expect(list.status).toBe(200);
    expect((await team.viewer.get(`${base}/decisions/00000000-0000-4000-8000-000000000000`)).status).toBe(404);
    expect((await team.viewer.get(`${base}/decisions/not-an-id/record.json`)).status).toBe(404);
    expect(list.body.length).toBeGreaterThan(0);
    const empty = await leadA.client.post(`${base}/decisions/${list.body[0].id}/return`, { comment: "   " });
    expect(empty.status).toBe(400);
    expect(empty.body.error.field).toBe("comment");
  }, 30_000);
});
