/**
 * A colour in plain words ("white", "dark blue", "light warm grey"), for
 * places where the shop has no name of its own for it. Lightness and
 * saturation follow the HSL model of CSS Color Module Level 4; the hue names
 * are the colour wheel's usual ones.
 */
export function colourWords(hex: string): string {
  const rgb = hexChannels(hex);
  if (!rgb) return 'an unnamed colour';
  const { h, s, l } = hsl(rgb);
  if (l >= 0.93) return 'white';
  if (l <= 0.1) return 'black';
  const shade = l >= 0.75 ? 'light ' : l <= 0.3 ? 'dark ' : '';
  if (s < 0.12) return `${shade}grey`;
  if (l >= 0.85 && (hue(h) === 'yellow' || hue(h) === 'orange')) return 'cream';
  if (s < 0.3) return `${shade}${hue(h)}-grey`;
  return `${shade}${hue(h)}`;
}

function hexChannels(hex: string): [number, number, number] | null {
  const m = /^#?([0-9a-f]{6}|[0-9a-f]{3})$/i.exec(hex.trim());
  if (!m) return null;
  const digits = m[1]!.length === 3 ? [...m[1]!].map((c) => c + c).join('') : m[1]!;
  return [0, 2, 4].map((i) => parseInt(digits.slice(i, i + 2), 16) / 255) as [number, number, number];
}

function hsl([r, g, b]: [number, number, number]): { h: number; s: number; l: number } {
  const high = r > g ? (r > b ? r : b) : g > b ? g : b;
  const low = r < g ? (r < b ? r : b) : g < b ? g : b;
  const l = (high + low) / 2;
  const d = high - low;
  if (d === 0) return { h: 0, s: 0, l };
  const s = d / (1 - Math.abs(2 * l - 1));
  const h = high === r ? 60 * (((g - b) / d + 6) % 6) : high === g ? 60 * ((b - r) / d + 2) : 60 * ((r - g) / d + 4);
  return { h, s, l };
}

const HUES: readonly [number, string][] = [
  [15, 'red'], [45, 'orange'], [70, 'yellow'], [160, 'green'], [190, 'teal'], [255, 'blue'], [320, 'purple'], [345, 'pink'], [360, 'red'],
];

function hue(degrees: number): string {
  return HUES.find(([upTo]) => degrees < upTo)?.[1] ?? 'red';
}
