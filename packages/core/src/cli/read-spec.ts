import { readFile } from "node:fs/promises";
import { CliInputError } from "./cli-error.js";

/**
 * Reads and parses one JSON spec from a file, or from standard input when `source` is "-".
 * Throws a CliInputError (one sentence) for a missing or unreadable file and for invalid JSON,
 * naming the line and column where the parser stopped when it can.
 */
export async function readSpec(source: string, stdin: NodeJS.ReadableStream = process.stdin): Promise<unknown> {
  const label = source === "-" ? "standard input" : source;
  let text: string;
  try {
    text = source === "-" ? await readAll(stdin) : await readFile(source, "utf8");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === "ENOENT") throw new CliInputError(`${label}: no such file; give the path of a JSON spec, or - to read standard input.`);
    if (code === "EISDIR") throw new CliInputError(`${label}: is a directory; give the path of a JSON spec file.`);
    if (code === "EACCES") throw new CliInputError(`${label}: permission denied; make the spec file readable.`);
    throw error;
  }
  if (text.trim() === "") throw new CliInputError(`${label}: is empty; give one JSON spec.`);
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    throw new CliInputError(`${label}: not valid JSON (${describeJsonError(text, error as Error)}).`);
  }
}

async function readAll(stream: NodeJS.ReadableStream): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === "string" ? Buffer.from(chunk) : (chunk as Buffer));
  return Buffer.concat(chunks).toString("utf8");
}

/** The parser's complaint with a line and column when the message carries a position. */
function describeJsonError(text: string, error: Error): string {
  const message = error.message.replace(/\s+/g, " ").replace(/\.$/, "");
  const match = /position (\d+)/.exec(message);
  if (!match) return message;
  const position = Number(match[1]);
  const before = text.slice(0, position);
  const line = before.split("\n").length;
  const column = position - before.lastIndexOf("\n");
  return `${message.replace(/ in JSON at position \d+.*$/, "")} at line ${line}, column ${column}`;
}
