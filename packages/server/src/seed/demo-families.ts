import { familyInputSchema } from "@loopyard/core";
import type { FamilyInput, FamilyRevisionDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { findFamilyIdByName, findFamilyWithRevisions, insertFamily, insertFamilyRevision } from "../families/family-repository.js";
import { findPlantIdByName, findPlantWithRevisions } from "../plants/plant-repository.js";

export const DEMO_FAMILY_NAME = "Ember line";
export const DEMO_SPREAD_FAMILY_NAME = "Ember 800 radiative — production spread";

/** A demo family revision: its entries name plants (revision 1) instead of revision ids. */
interface DemoFamilyRevision {
  name: string;
  description: string;
  note?: string;
  entries: { plant: string; label: string; parameters?: Record<string, number>; spread?: NonNullable<FamilyInput["definition"]["entries"][number]["spread"]> }[];
}

const LINE = [
  { plant: "Ember 200 plate", label: "Ember 200" },
  { plant: "Ember 400 plate", label: "Ember 400" },
  { plant: "Ember 800 plate", label: "Ember 800" },
];

/**
 * The demo families, each as its revisions in order:
 * - the Ember line: the three transfer-function plates (revision 1, the family of the demo
 *   comparison and the demo family sweep), then the radiative 800 plate on a warm shop floor
 *   added (revision 2: ambient Ta = 303 K instead of 293 K);
 * - the radiative 800 plate's production spread: heat capacity c ±10 % and convective loss h ±20 %
 *   around the nominal c = 400 J/K, h = 2 W/K, six plates drawn by a seeded Latin hypercube.
 */
export const DEMO_FAMILIES: readonly DemoFamilyRevision[][] = [
  [
    { name: DEMO_FAMILY_NAME, description: "The three plates sold today, as transfer functions.", note: "The line as sold in 2026.", entries: LINE },
    {
      name: DEMO_FAMILY_NAME,
      description: "The plates sold today, and the radiative 800 plate on a warm shop floor.",
      note: "Adds the radiative 800 plate at Ta = 303 K for the summer acceptance tests.",
      entries: [...LINE, { plant: "Ember 800 plate (radiative)", label: "Ember 800 radiative, warm floor", parameters: { Ta: 303 } }],
    },
  ],
  [
    {
      name: DEMO_SPREAD_FAMILY_NAME,
      description: "Heat capacity ±10 % and convective loss ±20 % around the nominal plate, as seen at end-of-line testing.",
      note: "Spread from the 2026 end-of-line measurements.",
      entries: [
        {
          plant: "Ember 800 plate (radiative)",
          label: "Ember 800",
          spread: { ranges: { c: { min: 360, max: 440, count: 1 }, h: { min: 1.6, max: 2.4, count: 1 } }, design: { kind: "latin-hypercube", count: 6, seed: 2026 } },
        },
      ],
    },
  ],
];

/**
 * Saves the demo families (once: a family found by name is left as it is). Returns how many
 * families it created. Needs the demo plants.
 */
export async function seedDemoFamilies(db: Database, workspaceId: string, userId: string): Promise<number> {
  let created = 0;
  for (const revisions of DEMO_FAMILIES) {
    const first = revisions[0];
    if (!first || (await findFamilyIdByName(db, workspaceId, first.name))) continue;
    let familyId: string | null = null;
    for (const demo of revisions) {
      const entries = [];
      for (const entry of demo.entries) {
        const plantId = await findPlantIdByName(db, workspaceId, entry.plant);
        const revision = plantId ? (await findPlantWithRevisions(db, workspaceId, plantId))?.revisions[0] : undefined;
        if (!revision) throw new Error(`the ${entry.plant} has no revision for the family ${demo.name}`);
        entries.push({ plantRevisionId: revision.id, label: entry.label, parameters: entry.parameters, spread: entry.spread });
      }
      const input = familyInputSchema.parse({ name: demo.name, description: demo.description, note: demo.note, definition: { entries } });
      if (familyId === null) familyId = await insertFamily(db, workspaceId, userId, input);
      else await insertFamilyRevision(db, familyId, userId, input);
    }
    created += 1;
  }
  return created;
}

/** Revision `number` of a demo family (seedDemoFamilies first). */
export async function findDemoFamilyRevision(db: Database, workspaceId: string, name: string, number: number): Promise<FamilyRevisionDto> {
  const familyId = await findFamilyIdByName(db, workspaceId, name);
  const revision = familyId ? (await findFamilyWithRevisions(db, workspaceId, familyId))?.revisions.find((r) => r.number === number) : undefined;
  if (!revision) throw new Error(`the demo family ${name} has no revision ${number}; seed the demo families first`);
  return revision;
}
