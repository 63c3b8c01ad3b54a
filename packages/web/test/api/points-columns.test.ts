import { describe, expect, it } from "vitest";
import { encodePointsBinary } from "@loopyard/core";
import { binaryPointsColumns, columnBuffers, toPointsColumns } from "../../src/api/points-columns.js";

const bytes = (column: Int32Array | Float64Array) => new Uint8Array(column.buffer, column.byteOffset, column.byteLength);

describe("points columns", () => {
  const dto = { x: "ise", y: "effort", total: 9, sampled: false, indices: [1, 5, 8], xs: [0.5, 0.25, 0.125], ys: [3, 4, 5], params: [[1, 2, 3]], plottable: ["ise", "effort"] } as const;

  it("the binary form reads back as the JSON form's columns, all views of one buffer", () => {
    const encoded = encodePointsBinary(
      { x: "ise", y: "effort", total: 9, sampled: false, plottable: ["ise", "effort"], count: 3, paramCount: 1 },
      { indices: bytes(Int32Array.from(dto.indices)), xs: bytes(Float64Array.from(dto.xs)), ys: bytes(Float64Array.from(dto.ys)), params: [bytes(Float64Array.from(dto.params[0]))] },
    );
    const fromBinary = binaryPointsColumns(encoded.slice().buffer);
    const fromJson = toPointsColumns({ ...dto, indices: [...dto.indices], xs: [...dto.xs], ys: [...dto.ys], params: [[...dto.params[0]]], plottable: [...dto.plottable] });
    expect(fromBinary).toEqual(fromJson);
    expect(columnBuffers(fromBinary)).toHaveLength(1);
    expect(columnBuffers(fromJson)).toHaveLength(4);
  });
});
