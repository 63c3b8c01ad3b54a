import { useState } from "react";
import type { FamilyDetailDto, SweepFamily } from "@loopyard/core";
import { useCreateFamily } from "../../api/use-families.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { inputClass } from "../../components/field.js";

/** "Save as family": the variants built in the form saved to the library under a name, then chosen. */
export function SaveAsFamily({
  slug,
  family,
  refusal,
  onSaved,
}: {
  slug: string;
  /** The variants as the form holds them now (undefined while they do not read). */
  family: () => SweepFamily | undefined;
  refusal: string | null;
  onSaved: (detail: FamilyDetailDto) => void;
}) {
  const create = useCreateFamily(slug);
  const [name, setName] = useState("");
  const [failure, setFailure] = useState<unknown>(null);
  const save = async () => {
    setFailure(null);
    const current = family();
    if (!current) {
      setFailure(new Error("Add at least one more variant, or fix the variants marked in red, before saving them as a family."));
      return;
    }
    try {
      const detail = await create.mutateAsync({
        name: name.trim(),
        description: "",
        note: "Saved from the sweep form.",
        definition: { entries: current.variants.map((v) => ({ ...v })) },
      });
      onSaved(detail);
    } catch (error) {
      setFailure(error);
    }
  };
  return (
    <div className="mt-3 flex flex-wrap items-center gap-2" data-testid="save-as-family">
      <input
        className={`${inputClass} max-w-xs`}
        placeholder="Family name, e.g. Ember line"
        aria-label="Family name"
        value={name}
        onChange={(e) => setName(e.target.value)}
        data-testid="save-as-family-name"
      />
      <Button disabled={Boolean(refusal) || create.isPending || name.trim() === ""} title={refusal ?? undefined} onClick={() => void save()} data-testid="save-as-family-button">
        {create.isPending ? "Saving…" : "Save as family"}
      </Button>
      {failure ? <ErrorNote error={failure} title="The family was not saved" /> : null}
    </div>
  );
}
