import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { LibraryFile, LibraryImportPlan } from "@loopyard/core";
import { apiFetch } from "./client.js";
import { queryKeys } from "./query-keys.js";

const libraryPath = (slug: string) => `/workspaces/${encodeURIComponent(slug)}/library`;

/** GET …/library/export[?plant=|?family=], saved by the browser as a .json file (docs/library-file.md). */
export function useExportLibrary(slug: string) {
  return useMutation({
    mutationFn: async (what: { plant?: string; family?: string; fileName: string }) => {
      const query = what.plant ? `?plant=${encodeURIComponent(what.plant)}` : what.family ? `?family=${encodeURIComponent(what.family)}` : "";
      const file = await apiFetch<LibraryFile>(`${libraryPath(slug)}/export${query}`);
      const url = URL.createObjectURL(new Blob([`${JSON.stringify(file, null, 2)}\n`], { type: "application/json" }));
      const link = document.createElement("a");
      link.href = url;
      link.download = what.fileName;
      link.click();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      return file;
    },
  });
}

/** POST …/library/import/preview (engineer+): what the import would create, rename and skip. */
export function usePreviewImport(slug: string) {
  return useMutation({
    mutationFn: (body: { file: unknown; onClash: "rename" | "skip" }) => apiFetch<LibraryImportPlan>(`${libraryPath(slug)}/import/preview`, { method: "POST", body }),
  });
}

/** POST …/library/import (engineer+): imports the file in one transaction. */
export function useImportLibrary(slug: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { file: unknown; onClash: "rename" | "skip" }) => apiFetch<LibraryImportPlan>(`${libraryPath(slug)}/import`, { method: "POST", body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.workspace(slug) }),
  });
}
