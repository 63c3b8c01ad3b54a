import { useState } from "react";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";

/**
 * Archive / Restore for a plant or family: archiving hides it from the pickers of new sweeps,
 * comparisons and families, and keeps everything that uses it. Disabled with the reason for a viewer.
 */
export function ArchiveControl({
  archivedAt,
  what,
  refusal,
  mutation,
}: {
  archivedAt: string | null;
  what: "plant" | "family";
  refusal: string | null;
  mutation: { mutateAsync: (archive: boolean) => Promise<unknown>; isPending: boolean };
}) {
  const [failure, setFailure] = useState<unknown>(null);
  const archived = archivedAt !== null;
  const run = async () => {
    setFailure(null);
    try {
      await mutation.mutateAsync(!archived);
    } catch (error) {
      setFailure(error);
    }
  };
  return (
    <>
      <Button
        tone="quiet"
        disabled={Boolean(refusal) || mutation.isPending}
        title={refusal ?? (archived ? `Offer this ${what} in the pickers again` : `Hide this ${what} from the pickers; what uses it keeps it`)}
        onClick={() => void run()}
        data-testid={archived ? `restore-${what}` : `archive-${what}`}
      >
        {mutation.isPending ? (archived ? "Restoring…" : "Archiving…") : archived ? "Restore" : "Archive"}
      </Button>
      {failure ? <ErrorNote error={failure} title={`The ${what} was not ${archived ? "restored" : "archived"}`} /> : null}
    </>
  );
}
