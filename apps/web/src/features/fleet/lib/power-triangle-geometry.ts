/**
 * Where the power triangle's lines and labels go. P (kW) runs along the ground from the origin,
 * Q (kvar) rises at its end (falls when leading), S (kVA) closes the triangle as the
 * hypotenuse; φ = atan2(Q, P) is the angle at the origin. One scale serves both axes, so the
 * drawn angle is the true φ [DERIVED] engineering-reference.md §6 (tan φ = Q/P).
 */

export type Point = { x: number; y: number };

/** What the API sends for one triangle (siteHealth.triangle.asInstalled / .now). */
export type TriangleFigures = { kw: number; kvar: number; kva: number; pf: number; phiDeg: number; leading: boolean };

export type TriangleLabel = Point & { anchor: 'start' | 'middle' | 'end' };

export type DrawnTriangle = {
  figures: TriangleFigures;
  /** The end of P on the ground, where Q stands. */
  ground: Point;
  /** The top of Q (its foot when leading), where S ends. */
  apex: Point;
  /** The φ arc at the origin, as an SVG path. */
  arcPath: string;
  phiLabel: TriangleLabel;
  qLabel: TriangleLabel;
  sLabel: TriangleLabel;
};

export type PowerTriangleLayout = {
  width: number;
  height: number;
  origin: Point;
  /** px per kW (= px per kvar). */
  scale: number;
  pLabel: TriangleLabel;
  asInstalled: DrawnTriangle;
  now: DrawnTriangle;
  /** The two triangles are the same (nothing lost): draw one. */
  coincident: boolean;
  /** Too narrow for values on the drawing: letters only, the values in a key beside it. */
  compact: boolean;
  /** The ray at the target PF, from the origin to above the end of P. */
  target: { end: Point; label: TriangleLabel; kvar: number } | null;
};

export type PowerTriangleInput = {
  asInstalled: TriangleFigures;
  now: TriangleFigures;
  /** The site's target PF (lagging); its ray is drawn when given. */
  targetPf?: number | null;
  /** The drawing's width in px (the figure's own width). */
  width: number;
  /** The tallest the drawing may get, px. */
  maxHeight?: number;
};

const pad = { left: 12, top: 28, bottom: 36 };
/** Room beside Q for its labels ("Q as installed 175 kvar" in two short lines; a bare "Q" when compact). */
const qLabelRoom = (width: number, compact: boolean) => (compact ? 22 : Math.min(132, Math.max(96, width * 0.3)));
/** Narrower than this the drawing carries letters only and the values go in a key beside it. */
export const compactBelowWidth = 520;
const minDrawnHeight = 48;
const labelGap = 34; // two 12 px lines plus air

/** Pushes label positions apart along y to at least `gap`, keeping their order; returns new y values in input order. */
export function separateLabels(ys: readonly number[], gap: number): number[] {
  const order = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
  for (let k = 1; k < order.length; k++) {
    const previous = order[k - 1]!;
    const current = order[k]!;
    if (current.y - previous.y < gap) current.y = previous.y + gap;
  }
  const out = new Array<number>(ys.length);
  for (const { y, i } of order) out[i] = y;
  return out;
}

/** The reactive power at the target PF, kvar: Q = P·tan(acos PF) [DERIVED] §6. */
export function targetKvar(kw: number, targetPf: number): number {
  return (kw * Math.sqrt(1 - targetPf * targetPf)) / targetPf;
}

export function layoutPowerTriangles({ asInstalled, now, targetPf = null, width, maxHeight = 380 }: PowerTriangleInput): PowerTriangleLayout {
  const kw = Math.max(now.kw, asInstalled.kw);
  const targetQ = targetPf && targetPf > 0 && targetPf <= 1 ? targetKvar(kw, targetPf) : null;
  const qs = [asInstalled.kvar, now.kvar, ...(targetQ === null ? [] : [targetQ])];
  const qMax = Math.max(0, ...qs);
  const qMin = Math.min(0, ...qs);
  const span = qMax - qMin;

  const compact = width < compactBelowWidth;
  const right = qLabelRoom(width, compact);
  const innerWidth = Math.max(40, width - pad.left - right);
  const innerHeightLimit = Math.max(minDrawnHeight, maxHeight - pad.top - pad.bottom);
  const scale = span > 0 ? Math.min(innerWidth / kw, innerHeightLimit / span) : innerWidth / kw;
  const drawnHeight = Math.max(minDrawnHeight, span * scale);
  // A flat triangle (PF near 1) sits mid-height in its minimum band.
  const slack = drawnHeight - span * scale;
  const originY = pad.top + slack / 2 + qMax * scale;
  const origin = { x: pad.left, y: originY };
  const height = pad.top + drawnHeight + pad.bottom;
  const at = (p: number, q: number): Point => ({ x: origin.x + p * scale, y: origin.y - q * scale });

  const drawnWidth = kw * scale;
  const arcRadius = Math.min(120, Math.max(28, drawnWidth * 0.3));
  const coincident = Math.abs(now.kvar - asInstalled.kvar) < 1e-9 && Math.abs(now.kw - asInstalled.kw) < 1e-9;
  // The triangle with the larger |Q| is the outer one; its S label sits outside it, the other's inside.
  const nowIsOuter = Math.abs(now.kvar) >= Math.abs(asInstalled.kvar);

  const draw = (figures: TriangleFigures, radius: number, outer: boolean): Omit<DrawnTriangle, 'qLabel'> & { qY: number } => {
    const ground = at(figures.kw, 0);
    const apex = at(figures.kw, figures.kvar);
    const phi = Math.atan2(figures.kvar, figures.kw);
    const arcEnd = { x: origin.x + radius * Math.cos(phi), y: origin.y - radius * Math.sin(phi) };
    // SVG y points down: a lagging (upward) angle turns anticlockwise on screen, sweep 0.
    const sweep = phi >= 0 ? 0 : 1;
    const arcPath = `M ${round(origin.x + radius)} ${round(origin.y)} A ${round(radius)} ${round(radius)} 0 0 ${sweep} ${round(arcEnd.x)} ${round(arcEnd.y)}`;
    const half = phi / 2;
    // The outer triangle's φ sits just outside its arc; the inner one's across the ground, clear of it.
    const phiLabel: TriangleLabel = outer
      ? { x: origin.x + (radius + 8) * Math.cos(half), y: origin.y - (radius + 8) * Math.sin(half) + (phi >= 0 ? 2 : 12), anchor: 'start' }
      : { x: origin.x + radius * 0.5, y: origin.y + (phi >= 0 ? 16 : -8), anchor: 'start' };
    // Normal to S pointing away from the foot of Q (outside the triangle) or towards it.
    const mid = { x: (origin.x + apex.x) / 2, y: (origin.y + apex.y) / 2 };
    const length = Math.hypot(apex.x - origin.x, apex.y - origin.y) || 1;
    let nx = -(apex.y - origin.y) / length;
    let ny = (apex.x - origin.x) / length;
    const towardsGround = (ground.x - mid.x) * nx + (ground.y - mid.y) * ny > 0;
    if (towardsGround === outer) {
      nx = -nx;
      ny = -ny;
    }
    const offset = 12;
    const sLabel: TriangleLabel = { x: mid.x + nx * offset, y: mid.y + ny * offset + (ny > 0 ? 10 : 0), anchor: nx < -0.2 ? 'end' : nx > 0.2 ? 'start' : 'middle' };
    return { figures, ground, apex, arcPath, phiLabel, sLabel, qY: apex.y };
  };

  const nowDrawn = draw(now, arcRadius, nowIsOuter);
  const installedDrawn = draw(asInstalled, coincident ? arcRadius : arcRadius * 0.62, !nowIsOuter);
  const targetEnd = targetQ === null ? null : at(kw, targetQ);
  // Labels beside Q at the height of what they name, never on top of each other.
  const wanted = compact
    ? [(nowDrawn.qY + origin.y) / 2 + 4]
    : [nowDrawn.qY - 4, ...(coincident ? [] : [installedDrawn.qY - 4]), ...(targetEnd ? [targetEnd.y + 4] : [])];
  const placed = separateLabels(wanted, labelGap);
  const nowQY = placed[0]!;
  const installedQY = coincident || compact ? nowQY : placed[1]!;
  const targetY = targetEnd && !compact ? placed[placed.length - 1]! : (targetEnd?.y ?? 0);
  const qx = origin.x + drawnWidth + 8;
  const strip = ({ qY: _qY, ...rest }: ReturnType<typeof draw>) => rest;

  const lowestLine = Math.max(origin.y, nowDrawn.apex.y, installedDrawn.apex.y);
  const lowestLabel = Math.max(...placed) + labelGap - 8;
  const target = targetEnd === null || targetQ === null ? null : { end: targetEnd, kvar: targetQ, label: { x: qx, y: targetY, anchor: 'start' as const } };

  return {
    width,
    height: Math.ceil(Math.max(height, lowestLine + pad.bottom, lowestLabel)),
    origin,
    scale,
    pLabel: { x: origin.x + drawnWidth / 2, y: lowestLine + 22, anchor: 'middle' },
    now: { ...strip(nowDrawn), qLabel: { x: qx, y: nowQY, anchor: 'start' } },
    asInstalled: { ...strip(installedDrawn), qLabel: { x: qx, y: installedQY, anchor: 'start' } },
    coincident,
    compact,
    target,
  };
}

const round = (n: number) => Math.round(n * 100) / 100;
