import { createHash } from "node:crypto";
import type { RequestHandler } from "express";
import multer from "multer";
import { MAX_STEP_TEST_BYTES, hasForbiddenControl } from "@loopyard/core";
import { HttpError } from "../http/http-error.js";

/** The multipart field that carries the step-test file. */
export const STEP_TEST_FIELD = "file";

/** File names a step test may have: CSV, TSV or plain text exports. */
const EXTENSIONS = [".csv", ".tsv", ".txt"];
/** Media types browsers and tools send for such files (spreadsheet programs often label CSV as Excel or octet-stream). */
const MEDIA_TYPES = ["text/csv", "text/tab-separated-values", "text/plain", "application/csv", "application/vnd.ms-excel", "application/octet-stream", ""];

/** A step-test file as received: its name, media type, size, hash and text. */
export interface ReceivedStepTest {
  fileName: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  text: string;
}

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_STEP_TEST_BYTES, files: 1, fields: 4, parts: 5, fieldSize: 1024 },
}).single(STEP_TEST_FIELD);

/**
 * Reads the multipart body of a step-test upload into memory (multer, at most MAX_STEP_TEST_BYTES,
 * one file in the field "file") and turns multer's refusals into sentences: 413 for a file over
 * 10 MB, 400 for another field or more than one file. Runs after the role check, so a refused
 * user's body is never read.
 */
export const receiveStepTest: RequestHandler = (req, res, next) => {
  if (!req.is("multipart/form-data")) {
    next(new HttpError(415, `Send the step test as multipart/form-data with the file in the field "${STEP_TEST_FIELD}".`));
    return;
  }
  upload(req, res, (error: unknown) => {
    if (error instanceof multer.MulterError) {
      if (error.code === "LIMIT_FILE_SIZE") {
        next(new HttpError(413, `The file is larger than the ${MAX_STEP_TEST_BYTES / 1024 / 1024} MB allowed; cut it to the step or thin its rows.`));
        return;
      }
      next(new HttpError(400, `Send one file in the field "${STEP_TEST_FIELD}" and nothing else (${error.message.toLowerCase()}).`, { field: STEP_TEST_FIELD }));
      return;
    }
    if (error) {
      next(new HttpError(400, "The upload could not be read as multipart/form-data; choose the file again.", { field: STEP_TEST_FIELD }));
      return;
    }
    next();
  });
};

/**
 * The uploaded file, checked for its type: a name ending in .csv, .tsv or .txt, a text media type,
 * UTF-8 text without NUL characters (a spreadsheet workbook is refused with a hint to export CSV).
 * Throws a 400 or 415 with a sentence naming the field "file".
 */
export function receivedStepTest(file: Express.Multer.File | undefined): ReceivedStepTest {
  if (!file) throw new HttpError(400, `Choose a CSV or TSV file to upload (the field "${STEP_TEST_FIELD}" is missing).`, { field: STEP_TEST_FIELD });
  // Browsers send the name as UTF-8; busboy reads header values as Latin-1.
  const rawName = Buffer.from(file.originalname, "latin1").toString("utf8");
  const fileName = (hasForbiddenControl(rawName) ? rawName.replace(/[\u0000-\u001F\u007F-\u009F]/g, "") : rawName).normalize("NFC").slice(0, 255) || "step-test.csv";
  const lower = fileName.toLowerCase();
  if (!EXTENSIONS.some((ext) => lower.endsWith(ext))) {
    throw new HttpError(415, `${fileName} is not a CSV or TSV file; export the step test as .csv or .tsv (time, input and output columns).`, { field: STEP_TEST_FIELD });
  }
  const mediaType = (file.mimetype ?? "").toLowerCase();
  if (!MEDIA_TYPES.includes(mediaType)) {
    throw new HttpError(415, `${fileName} was sent as ${mediaType}, not as text; export the step test as .csv or .tsv.`, { field: STEP_TEST_FIELD });
  }
  const bytes = file.buffer;
  if (bytes.includes(0)) {
    throw new HttpError(415, `${fileName} holds binary data (a NUL byte), not text; if it is a spreadsheet, export it as CSV.`, { field: STEP_TEST_FIELD });
  }
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new HttpError(415, `${fileName} is not UTF-8 text; save it as UTF-8 CSV.`, { field: STEP_TEST_FIELD });
  }
  return { fileName, mediaType: mediaType || "text/csv", sizeBytes: bytes.length, sha256: createHash("sha256").update(bytes).digest("hex"), text };
}
