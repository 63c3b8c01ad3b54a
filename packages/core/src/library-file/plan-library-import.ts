import type { LibraryFile } from "./library-file.js";

/** What an import does with one plant or family of the file. */
export interface ImportItemPlan {
  key: string;
  /** Its name in the file. */
  name: string;
  /** create: new under its own name; rename: new under `finalName` (its name is taken); skip: not imported (name taken, onClash skip, or a plant it needs was skipped). */
  action: "create" | "rename" | "skip";
  finalName: string;
  revisions: number;
  /** Why it is renamed or skipped, in a sentence; null when created as is. */
  reason: string | null;
}

export interface LibraryImportPlan {
  plants: ImportItemPlan[];
  families: ImportItemPlan[];
}

/**
 * The first free name of `name` among `taken`: "name (imported)", then "name (imported 2)", … Pure.
 */
export function importedName(name: string, taken: ReadonlySet<string>, max = 120): string {
  for (let i = 1; ; i++) {
    const suffix = i === 1 ? " (imported)" : ` (imported ${i})`;
    const candidate = `${name.slice(0, max - suffix.length)}${suffix}`;
    if (!taken.has(candidate)) return candidate;
  }
}

/**
 * What importing `file` into a workspace whose plants and families bear `existing` names creates:
 * each plant and family created under its name, renamed with a suffix (onClash "rename"), or
 * skipped (onClash "skip"). A family whose variants use a skipped plant is skipped too (its
 * variants would point at a plant that is not the file's). Names also may not clash inside the file.
 */
export function planLibraryImport(file: LibraryFile, existing: { plants: ReadonlySet<string>; families: ReadonlySet<string> }, onClash: "rename" | "skip"): LibraryImportPlan {
  const plan = (items: { key: string; name: string; revisions: unknown[] }[], names: ReadonlySet<string>, what: string): ImportItemPlan[] => {
    const taken = new Set(names);
    return items.map((item) => {
      const base = { key: item.key, name: item.name, revisions: item.revisions.length };
      if (!taken.has(item.name)) {
        taken.add(item.name);
        return { ...base, action: "create", finalName: item.name, reason: null };
      }
      if (onClash === "skip") return { ...base, action: "skip", finalName: item.name, reason: `the workspace already has a ${what} named “${item.name}”; it is kept as it is` };
      const finalName = importedName(item.name, taken);
      taken.add(finalName);
      return { ...base, action: "rename", finalName, reason: `the workspace already has a ${what} named “${item.name}”` };
    });
  };
  const plants = plan(file.plants, existing.plants, "plant");
  const skipped = new Set(plants.filter((p) => p.action === "skip").map((p) => p.key));
  const families = plan(file.families, existing.families, "family").map((f, i): ImportItemPlan => {
    if (f.action === "skip") return f;
    const uses = new Set(file.families[i]?.revisions.flatMap((r) => r.entries.map((e) => e.plant)));
    const missing = [...uses].filter((k) => skipped.has(k));
    if (missing.length === 0) return f;
    const names = missing.map((k) => file.plants.find((p) => p.key === k)?.name ?? k).join(", ");
    return { ...f, action: "skip", finalName: f.name, reason: `its variants use ${names}, which this import skips` };
  });
  return { plants, families };
}
