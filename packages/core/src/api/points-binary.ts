import type { PointsDto } from "./dto.js";

/**
 * Media type of the binary form of GET …/sweeps/:sweepId/points (a client asks for it in Accept;
 * without it the answer is PointsDto as JSON). Same content, exact, without printing and parsing
 * 10⁵ × (3 + parameters) numbers as text.
 */
export const POINTS_BINARY_TYPE = "application/x-loopyard-points";

/** PointsDto without its columns: the JSON header of the binary form, plus the point count. */
export type PointsHeader = Omit<PointsDto, "indices" | "xs" | "ys" | "params"> & { count: number; paramCount: number };

/** The columns of the binary form: indices as 32-bit integers, everything else as doubles. */
export interface PointsBinaryColumns {
  indices: Int32Array;
  xs: Float64Array;
  ys: Float64Array;
  params: Float64Array[];
}

const ALIGN = 8;
const pad = (n: number) => Math.ceil(n / ALIGN) * ALIGN;

/**
 * Layout, all little-endian: uint32 length L of the header; L bytes of UTF-8 JSON (PointsHeader);
 * zero bytes up to a multiple of 8; then `count` int32 indices, zero bytes up to a multiple of 8; then
 * `count` float64 xs, `count` float64 ys and `count` float64 per parameter. Every column starts on an
 * 8-byte boundary, so a reader takes typed-array views of it without copying.
 */
export function pointsBinaryLayout(headerBytes: number, count: number, paramCount: number): { indices: number; xs: number; ys: number; params: number[]; total: number } {
  const indices = pad(4 + headerBytes);
  const xs = pad(indices + 4 * count);
  const ys = xs + 8 * count;
  const params = Array.from({ length: paramCount }, (_, k) => ys + 8 * count * (k + 1));
  return { indices, xs, ys, params, total: ys + 8 * count * (paramCount + 1) };
}

/**
 * Writes the header and the columns' little-endian bytes (as produced by `columnBytes`) into one
 * buffer. `columnBytes` are raw little-endian column bytes: count × 4 for indices, count × 8 for the others.
 */
export function encodePointsBinary(header: PointsHeader, columnBytes: { indices: Uint8Array; xs: Uint8Array; ys: Uint8Array; params: Uint8Array[] }): Uint8Array {
  const json = new TextEncoder().encode(JSON.stringify(header));
  const { count, paramCount } = header;
  if (columnBytes.params.length !== paramCount) throw new RangeError(`header says ${paramCount} parameters, got ${columnBytes.params.length} columns`);
  const expect = (bytes: Uint8Array, width: number, name: string) => {
    if (bytes.length !== width * count) throw new RangeError(`${name}: ${bytes.length} bytes for ${count} points of ${width} bytes`);
  };
  expect(columnBytes.indices, 4, "indices");
  expect(columnBytes.xs, 8, "xs");
  expect(columnBytes.ys, 8, "ys");
  columnBytes.params.forEach((column, k) => expect(column, 8, `params[${k}]`));
  const layout = pointsBinaryLayout(json.length, count, paramCount);
  const out = new Uint8Array(layout.total);
  new DataView(out.buffer).setUint32(0, json.length, true);
  out.set(json, 4);
  out.set(columnBytes.indices, layout.indices);
  out.set(columnBytes.xs, layout.xs);
  out.set(columnBytes.ys, layout.ys);
  columnBytes.params.forEach((column, k) => out.set(column, layout.params[k] as number));
  return out;
}

/** Reads the binary form: the header and views of its columns (no copy; the buffer must be little-endian data as written). */
export function decodePointsBinary(buffer: ArrayBuffer): { header: PointsHeader; columns: PointsBinaryColumns } {
  if (buffer.byteLength < 4) throw new RangeError("points: the answer is too short to hold a header");
  const headerBytes = new DataView(buffer).getUint32(0, true);
  if (4 + headerBytes > buffer.byteLength) throw new RangeError("points: the header runs past the end of the answer");
  const header = JSON.parse(new TextDecoder().decode(new Uint8Array(buffer, 4, headerBytes))) as PointsHeader;
  const { count, paramCount } = header;
  const layout = pointsBinaryLayout(headerBytes, count, paramCount);
  if (layout.total !== buffer.byteLength) throw new RangeError(`points: expected ${layout.total} bytes for ${count} points, got ${buffer.byteLength}`);
  return {
    header,
    columns: {
      indices: new Int32Array(buffer, layout.indices, count),
      xs: new Float64Array(buffer, layout.xs, count),
      ys: new Float64Array(buffer, layout.ys, count),
      params: layout.params.map((offset) => new Float64Array(buffer, offset, count)),
    },
  };
}
