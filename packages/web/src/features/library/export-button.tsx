import { useExportLibrary } from "../../api/use-library.js";
import { Button } from "../../components/button.js";

/** Downloads a library file: the whole library, one plant, or one family with its plants. */
export function ExportButton({ slug, plant, family, fileName, label = "Export" }: { slug: string; plant?: string; family?: string; fileName: string; label?: string }) {
  const exporting = useExportLibrary(slug);
  const what: { plant?: string; family?: string; fileName: string } = { fileName };
  if (plant) what.plant = plant;
  if (family) what.family = family;
  return (
    <Button
      tone="quiet"
      disabled={exporting.isPending}
      title={exporting.isError ? `The export failed: ${(exporting.error as Error).message}` : "Download as a Loopyard library file (JSON)"}
      onClick={() => exporting.mutate(what)}
      data-testid="export-library"
    >
      {exporting.isPending ? "Exporting…" : label}
    </Button>
  );
}

/** A file name from a name: lower case, dashes, .json. */
export function libraryFileName(name: string): string {
  return `${name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "library"}.loopyard.json`;
}
