import { Router } from "express";
import { z } from "zod";
import { libraryImportOptionsSchema } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { parseBody, parseQuery } from "../http/validation.js";
import { accessOf, memberOf } from "../workspaces/require-member.js";
import { exportLibrary, importLibrary, previewLibraryImport } from "./library-service.js";

const exportQuerySchema = z.object({
  plant: z.uuid("plant must be a plant's id").optional(),
  family: z.uuid("family must be a family's id").optional(),
});

/** /api/workspaces/:slug/library — library files (docs/library-file.md): export, preview an import, import. */
export function libraryRoutes(db: Database): Router {
  const router = Router({ mergeParams: true });

  router.get("/export", memberOf(db, "viewer", "Exporting the library"), async (req, res) => {
    const query = parseQuery(exportQuerySchema, req);
    const file = await exportLibrary(db, accessOf(req), query);
    res.setHeader("Content-Disposition", `attachment; filename="loopyard-library-${accessOf(req).workspace.slug}.json"`);
    res.json(file);
  });

  router.post("/import/preview", memberOf(db, "engineer", "Importing into the library"), async (req, res) => {
    const { file, onClash } = parseBody(libraryImportOptionsSchema, req);
    res.json(await previewLibraryImport(db, accessOf(req), file, onClash));
  });

  router.post("/import", memberOf(db, "engineer", "Importing into the library"), async (req, res) => {
    const { file, onClash } = parseBody(libraryImportOptionsSchema, req);
    res.status(201).json(await importLibrary(db, accessOf(req), file, onClash));
  });

  return router;
}
