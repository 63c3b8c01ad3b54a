import { and, eq } from "drizzle-orm";
import type { StepTestDto, StepTestOverview } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { stepTest, user } from "../db/schema.js";
import { userDtoColumns } from "../users/user-repository.js";
import type { ReceivedStepTest } from "./step-test-upload.js";

const dtoColumns = {
  id: stepTest.id,
  fileName: stepTest.fileName,
  sizeBytes: stepTest.sizeBytes,
  overview: stepTest.overview,
  createdAt: stepTest.createdAt,
  createdBy: userDtoColumns,
};

/** Stores an uploaded step test with its overview; returns its id. */
export async function insertStepTest(db: Database, workspaceId: string, userId: string, file: ReceivedStepTest, overview: StepTestOverview): Promise<string> {
  const [row] = await db
    .insert(stepTest)
    .values({ workspaceId, fileName: file.fileName, mediaType: file.mediaType, sizeBytes: file.sizeBytes, sha256: file.sha256, content: file.text, overview, createdBy: userId })
    .returning({ id: stepTest.id });
  if (!row) throw new Error("insert into step_test returned no row");
  return row.id;
}

/** A step test of the workspace as the API shows it (without its text), or null. */
export async function findStepTest(db: Database, workspaceId: string, id: string): Promise<StepTestDto | null> {
  const rows = await db
    .select(dtoColumns)
    .from(stepTest)
    .innerJoin(user, eq(user.id, stepTest.createdBy))
    .where(and(eq(stepTest.workspaceId, workspaceId), eq(stepTest.id, id)))
    .limit(1);
  const row = rows[0];
  if (!row) return null;
  return { id: row.id, fileName: row.fileName, sizeBytes: row.sizeBytes, overview: row.overview as StepTestOverview, createdAt: row.createdAt.toISOString(), createdBy: row.createdBy };
}

/** The text and name of a step test of the workspace, or null. */
export async function findStepTestText(db: Database, workspaceId: string, id: string): Promise<{ fileName: string; text: string } | null> {
  const rows = await db
    .select({ fileName: stepTest.fileName, text: stepTest.content })
    .from(stepTest)
    .where(and(eq(stepTest.workspaceId, workspaceId), eq(stepTest.id, id)))
    .limit(1);
  return rows[0] ?? null;
}
