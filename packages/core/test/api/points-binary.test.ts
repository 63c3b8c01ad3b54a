import { describe, expect, it } from "vitest";
import { decodePointsBinary, encodePointsBinary, pointsBinaryLayout, type PointsHeader } from "../../src/api/points-binary.js";

const bytes = (column: Int32Array | Float64Array) => new Uint8Array(column.buffer, column.byteOffset, column.byteLength);

describe("binary points", () => {
  it("round-trips the header and every column exactly, each column 8-byte aligned", () => {
    const header: PointsHeader = { x: "ise", y: "effort", total: 7, sampled: false, plottable: ["ise", "effort"], count: 3, paramCount: 2 };
    const indices = Int32Array.from([0, 4, 6]);
    const xs = Float64Array.from([0.1, 1 / 3, 2.5e-300]);
    const ys = Float64Array.from([12345.678901234567, Math.PI, 7e200]);
    const params = [Float64Array.from([1, 2, 3]), Float64Array.from([-0.5, 1e-9, 42])];
    const encoded = encodePointsBinary(header, { indices: bytes(indices), xs: bytes(xs), ys: bytes(ys), params: params.map(bytes) });
    const copy = encoded.slice().buffer;
    const { header: read, columns } = decodePointsBinary(copy);
    expect(read).toEqual(header);
    expect([...columns.indices]).toEqual([...indices]);
    expect([...columns.xs]).toEqual([...xs]);
    expect([...columns.ys]).toEqual([...ys]);
    expect(columns.params.map((c) => [...c])).toEqual(params.map((c) => [...c]));
    for (const column of [columns.indices, columns.xs, columns.ys, ...columns.params]) expect(column.byteOffset % 8).toBe(0);
  });

  it("an empty cloud is a header alone", () => {
    const header: PointsHeader = { x: "iae", y: "effort", total: 0, sampled: false, plottable: [], count: 0, paramCount: 1 };
    const empty = new Uint8Array(0);
    const { columns } = decodePointsBinary(encodePointsBinary(header, { indices: empty, xs: empty, ys: empty, params: [empty] }).slice().buffer);
    expect(columns.xs.length).toBe(0);
    expect(columns.params).toHaveLength(1);
  });

  it("refuses columns of the wrong length and answers cut short", () => {
    const header: PointsHeader = { x: "iae", y: "effort", total: 2, sampled: false, plottable: [], count: 2, paramCount: 0 };
    expect(() => encodePointsBinary(header, { indices: new Uint8Array(8), xs: new Uint8Array(8), ys: new Uint8Array(16), params: [] })).toThrow(/xs: 8 bytes for 2 points/);
    const good = encodePointsBinary(header, { indices: new Uint8Array(8), xs: new Uint8Array(16), ys: new Uint8Array(16), params: [] });
    expect(() => decodePointsBinary(good.slice(0, good.length - 8).buffer)).toThrow(/expected \d+ bytes/);
    expect(() => decodePointsBinary(new ArrayBuffer(2))).toThrow(/too short/);
    expect(pointsBinaryLayout(5, 2, 0)).toEqual({ indices: 16, xs: 24, ys: 40, params: [], total: 56 });
  });
});
