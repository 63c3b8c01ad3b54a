import { describe, expect, it } from "vitest";
import { LABEL_GAPS, labelWidth, MARKER_CLEARANCE, placeLabels } from "../../../src/features/fronts/label-placement.js";

type Box = { x0: number; y0: number; x1: number; y1: number };
const boxOf = (anchor: { x: number; y: number }, size: { width: number; height: number }, offset: { dx: number; dy: number }): Box => ({
  x0: anchor.x + offset.dx - size.width / 2,
  y0: anchor.y + offset.dy - size.height / 2,
  x1: anchor.x + offset.dx + size.width / 2,
  y1: anchor.y + offset.dy + size.height / 2,
});
const overlaps = (a: Box, b: Box) => Math.min(a.x1, b.x1) > Math.max(a.x0, b.x0) && Math.min(a.y1, b.y1) > Math.max(a.y0, b.y0);

describe("placeLabels", () => {
  const area = { width: 500, height: 300 };
  const size = { width: 60, height: 16 };

  it("placeLabels puts a lone label right of its marker at the nearest gap (closed form: dx = gap + width/2, dy = 0)", () => {
    const [offset] = placeLabels([{ x: 100, y: 150 }], [size], area);
    expect(offset?.dx).toBeCloseTo(LABEL_GAPS[0] + size.width / 2, 9);
    expect(offset?.dy).toBeCloseTo(0, 9);
  });

  it("placeLabels keeps a label inside the plot area: a marker at the right edge is labelled on its left", () => {
    const [offset] = placeLabels([{ x: 495, y: 150 }], [size], area);
    expect(offset?.dx).toBeLessThan(0);
    const box = boxOf({ x: 495, y: 150 }, size, offset!);
    expect(box.x0).toBeGreaterThanOrEqual(0);
    expect(box.x1).toBeLessThanOrEqual(area.width);
  });

  it("placeLabels separates the labels of a tight cluster: no two overlap, none covers a marker, all inside the area (invariants, common practice)", () => {
    // Six tuning-rule markers within a 12 px square, as the rules of one plant tend to fall.
    const anchors = [
      { x: 200, y: 150 },
      { x: 206, y: 152 },
      { x: 203, y: 158 },
      { x: 210, y: 147 },
      { x: 198, y: 160 },
      { x: 212, y: 156 },
    ];
    const sizes = ["SIMC PI", "SIMC PID", "AMIGO PI", "AMIGO PID", "Lambda PI", "IMC PID"].map((t) => ({ width: labelWidth(t, 10), height: 16 }));
    const offsets = placeLabels(anchors, sizes, area);
    const boxes = offsets.map((o, i) => boxOf(anchors[i]!, sizes[i]!, o));
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) expect(overlaps(boxes[i]!, boxes[j]!)).toBe(false);
      for (const a of anchors) {
        const mark = { x0: a.x - MARKER_CLEARANCE, y0: a.y - MARKER_CLEARANCE, x1: a.x + MARKER_CLEARANCE, y1: a.y + MARKER_CLEARANCE };
        expect(overlaps(boxes[i]!, mark)).toBe(false);
      }
      expect(boxes[i]!.x0).toBeGreaterThanOrEqual(0);
      expect(boxes[i]!.y0).toBeGreaterThanOrEqual(0);
      expect(boxes[i]!.x1).toBeLessThanOrEqual(area.width);
      expect(boxes[i]!.y1).toBeLessThanOrEqual(area.height);
    }
  });

  it("placeLabels keeps labels off the obstacles (the front's points)", () => {
    // A front point right of the marker, where the first choice would go.
    const anchor = { x: 100, y: 150 };
    const [offset] = placeLabels([anchor], [size], area, [{ x: 140, y: 150 }]);
    const box = boxOf(anchor, size, offset!);
    expect(overlaps(box, { x0: 134, y0: 144, x1: 146, y1: 156 })).toBe(false);
  });

  it("placeLabels refuses sizes that do not match the anchors with a RangeError", () => {
    expect(() => placeLabels([{ x: 0, y: 0 }], [], area)).toThrow(RangeError);
  });
});
