import type { ComparisonAcrossDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import type { MemberAccess } from "../workspaces/require-member.js";

export async function getComparisonsAcross(_db: Database, _access: MemberAccess, judge: string | undefined): Promise<ComparisonAcrossDto> {
  return { judge: judge ?? "", columns: [], comparisons: [], rows: [] };
}
