import { describe, expect, it } from 'vitest';
import { contrastPairs, palette, themeNames } from '../../../../tailwind.config';

/** WCAG 2.2 relative luminance of an sRGB colour written #rrggbb. */
function relativeLuminance(hex: string): number {
  const channels = [1, 3, 5].map((start) => Number.parseInt(hex.slice(start, start + 2), 16) / 255);
  const [r = 0, g = 0, b = 0] = channels.map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrastRatio(a: string, b: string): number {
  const [lighter, darker] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return ((lighter ?? 0) + 0.05) / ((darker ?? 0) + 0.05);
}

describe('design tokens meet WCAG 2.2 AA', () => {
  it('computes contrast as WCAG does', () => {
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 5);
    expect(contrastRatio('#777777', '#FFFFFF')).toBeCloseTo(4.48, 2);
  });

  for (const theme of themeNames) {
    for (const { foreground, background, minimum } of contrastPairs) {
      it(`${theme}: ${foreground} on ${background} ≥ ${minimum}:1`, () => {
        expect(contrastRatio(palette[theme][foreground], palette[theme][background])).toBeGreaterThanOrEqual(minimum);
      });
    }
  }
});
