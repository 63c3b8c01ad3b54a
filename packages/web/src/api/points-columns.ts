import { decodePointsBinary, type PointsDto } from "@loopyard/core";

/** A PointsDto with typed-array columns, as the binary form of the points carries them (core points-binary.ts). */
export type PointsColumns = Omit<PointsDto, "indices" | "xs" | "ys" | "params"> & {
  indices: Int32Array;
  xs: Float64Array;
  ys: Float64Array;
  /** One column per swept parameter, aligned with indices. */
  params: Float64Array[];
};

/** The columns of a PointsDto (the JSON form) as typed arrays. */
export function toPointsColumns(dto: PointsDto): PointsColumns {
  return {
    ...dto,
    indices: Int32Array.from(dto.indices),
    xs: Float64Array.from(dto.xs),
    ys: Float64Array.from(dto.ys),
    params: dto.params.map((column) => Float64Array.from(column)),
  };
}

/** The binary form of the points as PointsColumns: views of `buffer`, no copy. */
export function binaryPointsColumns(buffer: ArrayBuffer): PointsColumns {
  const { header, columns } = decodePointsBinary(buffer);
  const { count: _count, paramCount: _paramCount, ...dto } = header;
  return { ...dto, ...columns };
}

/** The distinct buffers under the columns, to transfer them to another thread. */
export function columnBuffers(columns: PointsColumns): ArrayBuffer[] {
  return [...new Set([columns.indices, columns.xs, columns.ys, ...columns.params].map((column) => column.buffer as ArrayBuffer))];
}
