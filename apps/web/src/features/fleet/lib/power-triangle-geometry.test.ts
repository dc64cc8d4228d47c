import { describe, expect, test } from 'vitest';
import { compactBelowWidth, layoutPowerTriangles, separateLabels, targetKvar, type TriangleFigures } from './power-triangle-geometry';

const figures = (kw: number, kvar: number): TriangleFigures => {
  const kva = Math.hypot(kw, kvar);
  return { kw, kvar, kva, pf: kw / kva, phiDeg: (Math.atan2(kvar, kw) * 180) / Math.PI, leading: kvar < 0 };
};

/** The angle the drawing shows at the origin, degrees (SVG y points down). */
const drawnPhiDeg = (origin: { x: number; y: number }, apex: { x: number; y: number }) =>
  (Math.atan2(origin.y - apex.y, apex.x - origin.x) * 180) / Math.PI;

describe('layoutPowerTriangles', () => {
  // 500 kW; 375 kvar of load less 200 kvar installed = 175 kvar, less 100 kvar effective = 275 kvar.
  const asInstalled = figures(500, 175);
  const now = figures(500, 275);

  test('draws P along the ground, Q upright and φ at its true angle with one scale for both axes', () => {
    const layout = layoutPowerTriangles({ asInstalled, now, width: 640 });
    for (const t of [layout.now, layout.asInstalled]) {
      expect(t.ground.y).toBeCloseTo(layout.origin.y, 9);
      expect(t.apex.x).toBeCloseTo(t.ground.x, 9);
      expect((t.ground.x - layout.origin.x) / t.figures.kw).toBeCloseTo(layout.scale, 9);
      expect((t.ground.y - t.apex.y) / t.figures.kvar).toBeCloseTo(layout.scale, 9);
      // [DERIVED] engineering-reference.md §6: tan φ = Q/P, so the drawn angle is φ itself.
      expect(drawnPhiDeg(layout.origin, t.apex)).toBeCloseTo(t.figures.phiDeg, 9);
    }
    expect(drawnPhiDeg(layout.origin, layout.now.apex)).toBeCloseTo((Math.atan(275 / 500) * 180) / Math.PI, 9);
    expect(layout.coincident).toBe(false);
  });

  test('keeps everything inside its width, with room beside Q for the labels', () => {
    for (const width of [300, 360, 640, 1000]) {
      const layout = layoutPowerTriangles({ asInstalled, now, width });
      const xs = [layout.origin.x, layout.now.ground.x, layout.now.qLabel.x, layout.asInstalled.qLabel.x];
      for (const x of xs) {
        expect(x).toBeGreaterThanOrEqual(0);
        expect(x).toBeLessThan(width);
      }
      // Wide enough: values beside Q; narrower: letters only (the figure lists the values in a key).
      if (width >= compactBelowWidth) expect(width - layout.now.qLabel.x).toBeGreaterThanOrEqual(88);
      expect(layout.compact).toBe(width < compactBelowWidth);
      expect(layout.height).toBeGreaterThan(layout.origin.y);
    }
  });

  test('a low PF is scaled down to the height limit rather than drawn taller', () => {
    const layout = layoutPowerTriangles({ asInstalled: figures(500, 700), now: figures(500, 866), width: 1000, maxHeight: 380 });
    expect(layout.height).toBeLessThanOrEqual(380 + 1);
    expect(drawnPhiDeg(layout.origin, layout.now.apex)).toBeCloseTo(60, 1); // PF 0.5 ↔ φ 60°
  });

  test('a leading triangle hangs below the ground, its arc turning clockwise, P labelled below it', () => {
    const layout = layoutPowerTriangles({ asInstalled: figures(200, -80), now: figures(200, -40), width: 640 });
    expect(layout.now.apex.y).toBeGreaterThan(layout.origin.y);
    expect(layout.asInstalled.apex.y).toBeGreaterThan(layout.now.apex.y);
    expect(layout.now.arcPath).toMatch(/A [\d.]+ [\d.]+ 0 0 1 /);
    expect(layout.pLabel.y).toBeGreaterThan(layout.asInstalled.apex.y);
    expect(layout.height).toBeGreaterThan(layout.pLabel.y);
  });

  test('nothing lost: one triangle and one Q label', () => {
    const layout = layoutPowerTriangles({ asInstalled: now, now, width: 640 });
    expect(layout.coincident).toBe(true);
    expect(layout.asInstalled.qLabel).toEqual(layout.now.qLabel);
  });

  test('the target ray rises to P·tan(acos PF) and its label keeps clear of the Q labels', () => {
    const layout = layoutPowerTriangles({ asInstalled, now, targetPf: 0.95, width: 640 });
    expect(layout.target).not.toBeNull();
    expect((layout.origin.y - layout.target!.end.y) / layout.scale).toBeCloseTo(targetKvar(500, 0.95), 9);
    const ys = [layout.now.qLabel.y, layout.asInstalled.qLabel.y, layout.target!.label.y].sort((a, b) => a - b);
    expect(ys[1]! - ys[0]!).toBeGreaterThanOrEqual(34);
    expect(ys[2]! - ys[1]!).toBeGreaterThanOrEqual(34);
  });
});

describe('targetKvar', () => {
  test('[DERIVED] §6: 500 kW at PF 0.95 carries 500·tan(acos 0.95) = 164.3 kvar', () => {
    expect(targetKvar(500, 0.95)).toBeCloseTo(164.34, 2);
  });
});

describe('separateLabels', () => {
  test('pushes close labels apart in their order and leaves distant ones alone', () => {
    expect(separateLabels([100, 110, 300], 34)).toEqual([100, 134, 300]);
    expect(separateLabels([110, 100], 34)).toEqual([134, 100]);
    expect(separateLabels([10, 200], 34)).toEqual([10, 200]);
  });
});
