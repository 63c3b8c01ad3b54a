import { useState } from "react";
import type { ImportItemPlan } from "@loopyard/core";
import { Link } from "react-router";
import { useImportLibrary, usePreviewImport } from "../../api/use-library.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { PageHeader } from "../../components/page-header.js";
import { RoleNote } from "../../components/role-note.js";
import { Section } from "../../components/section.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";

const ACTION_TONE: Record<ImportItemPlan["action"], string> = { create: "text-moss", rename: "text-ink", skip: "text-rust" };

/** /w/:slug/library/import — choose a library file, see what it would create, rename or skip, then import it. */
export function LibraryImportPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const preview = usePreviewImport(slug);
  const importing = useImportLibrary(slug);
  const [file, setFile] = useState<unknown>(null);
  const [fileName, setFileName] = useState("");
  const [readFailure, setReadFailure] = useState<string | null>(null);
  const [onClash, setOnClash] = useState<"rename" | "skip">("rename");
  const refusal = workspace.data && !canEdit ? roleSentence("Importing into the library", "engineer", workspace.data.workspace.name, role) : null;

  const choose = async (chosen: File | undefined) => {
    setReadFailure(null);
    preview.reset();
    importing.reset();
    if (!chosen) return;
    setFileName(chosen.name);
    try {
      const parsed: unknown = JSON.parse(await chosen.text());
      setFile(parsed);
      preview.mutate({ file: parsed, onClash });
    } catch {
      setFile(null);
      setReadFailure(`${chosen.name} is not JSON; choose a file exported from Loopyard (Export library).`);
    }
  };
  const rows = (items: ImportItemPlan[], what: string) =>
    items.map((item) => (
      <tr key={`${what}-${item.key}`} className="border-t border-line-soft" data-testid="import-row">
        <td className="py-1.5 pr-3 text-xs text-ink-soft">{what}</td>
        <td className="py-1.5 pr-3">{item.name}</td>
        <td className={`py-1.5 pr-3 font-mono text-xs ${ACTION_TONE[item.action]}`} data-testid="import-action">
          {item.action}
        </td>
        <td className="py-1.5 pr-3">{item.action === "skip" ? <span className="text-ink-faint">—</span> : item.finalName}</td>
        <td className="py-1.5 pr-3 text-right font-mono text-xs">{item.revisions}</td>
        <td className="py-1.5 text-xs text-ink-soft">{item.reason ?? ""}</td>
      </tr>
    ));
  const plan = importing.data ?? preview.data;
  return (
    <div data-testid="library-import-page">
      <PageHeader
        title="Import into the library"
        back={{ to: `/w/${slug}/plants`, label: "Library" }}
        subtitle="A Loopyard library file (docs/library-file.md): plants and families with every revision. You see what it creates before it does."
      />
      {refusal ? <RoleNote sentence={refusal} /> : null}
      <Section title="File">
        <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
          <Field label="Library file" htmlFor="library-file" name="file" error={readFailure ?? undefined} hint={fileName || "a .json file from Export library"}>
            <input id="library-file" type="file" accept="application/json,.json" className={inputClass} onChange={(e) => void choose(e.target.files?.[0])} data-testid="library-file" />
          </Field>
          <fieldset>
            <legend className="mb-1 block text-xs font-medium text-ink-soft">When a name is taken</legend>
            {(["rename", "skip"] as const).map((choice) => (
              <label key={choice} className="mr-4 inline-flex items-center gap-2 text-sm">
                <input
                  type="radio"
                  className="accent-moss"
                  checked={onClash === choice}
                  onChange={() => {
                    setOnClash(choice);
                    if (file !== null) preview.mutate({ file, onClash: choice });
                  }}
                  data-testid={`on-clash-${choice}`}
                />
                {choice === "rename" ? "import it with “(imported)” added" : "keep the workspace's, skip the file's"}
              </label>
            ))}
          </fieldset>
        </div>
      </Section>
      <div className="mt-6">
        <Section title={importing.data ? "Imported" : "What the import does"} aside={plan ? `${plan.plants.length} plants, ${plan.families.length} families in the file` : undefined} testId="import-plan">
          {preview.isError ? <ErrorNote error={preview.error} title="This file cannot be imported" /> : null}
          {importing.isError ? <ErrorNote error={importing.error} title="Nothing was imported" /> : null}
          {!plan && !preview.isError ? <p className="text-sm text-ink-soft">Choose a file; its plants and families are listed here with what happens to each.</p> : null}
          {plan ? (
            <table className="w-full text-sm">
              <thead>
                <tr className="text-left text-xs text-ink-soft">
                  <th className="py-1 pr-3 font-medium">What</th>
                  <th className="py-1 pr-3 font-medium">Name in the file</th>
                  <th className="py-1 pr-3 font-medium">Action</th>
                  <th className="py-1 pr-3 font-medium">Name here</th>
                  <th className="py-1 pr-3 text-right font-medium">Revisions</th>
                  <th className="py-1 font-medium">Why</th>
                </tr>
              </thead>
              <tbody>
                {rows(plan.plants, "plant")}
                {rows(plan.families, "family")}
              </tbody>
            </table>
          ) : null}
          {importing.data ? (
            <p className="mt-3 text-sm text-moss" data-testid="import-done">
              Imported. <Link to={`/w/${slug}/plants`} className="underline">Open the library</Link> or <Link to={`/w/${slug}/families`} className="underline">the families</Link>.
            </p>
          ) : (
            <Button
              tone="primary"
              className="mt-4"
              disabled={!preview.data || importing.isPending || Boolean(refusal)}
              onClick={() => importing.mutate({ file, onClash })}
              data-testid="import-submit"
            >
              {importing.isPending ? "Importing…" : "Import"}
            </Button>
          )}
        </Section>
      </div>
    </div>
  );
}
