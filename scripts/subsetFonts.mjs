// `npm run fonts:subset`: splits each Manrope face (fonts/*.ttf) into two woff2 files,
//   fonts/<face>-latin.woff2     the Latin characters: every screen's text, preloaded by every page
//   fonts/<face>-extended.woff2  the rest of the face (Latin Extended, Vietnamese, Greek, Cyrillic),
//                                downloaded by the browser only for a page that shows one of them
// and writes fonts/faces.json: each file with its family and the unicode-range its @font-face
// rule gets (webBuildFinish.mjs reads it). One face whole is ~31 KB; its Latin part is ~14 KB,
// and a phone on a slow line waits for all three faces before the first paint.
// Run again after changing a .ttf or the ranges; the output is checked in.
import fs from 'node:fs';
import path from 'node:path';
import * as fontkit from 'fontkit';
import subsetFont from 'subset-font';

const root = path.resolve(path.dirname(new URL(import.meta.url).pathname), '..');

/** The faces theme.ts names (fonts.regular, .semibold, .bold). */
export const FACES = ['Manrope_400Regular', 'Manrope_600SemiBold', 'Manrope_700Bold'];

/**
 * The "latin" subset as web-font services commonly publish it (Basic Latin, Latin-1, the
 * General Punctuation block, euro, trade mark, minus and a few more), plus the four simple
 * arrows, which the app's screens use.
 */
export const LATIN_RANGES = [
  [0x0000, 0x00ff], [0x0131, 0x0131], [0x0152, 0x0153], [0x02bb, 0x02bc], [0x02c6, 0x02c6], [0x02da, 0x02da], [0x02dc, 0x02dc],
  [0x0304, 0x0304], [0x0308, 0x0308], [0x0329, 0x0329], [0x2000, 0x206f], [0x20ac, 0x20ac], [0x2122, 0x2122], [0x2190, 0x2193],
  [0x2212, 0x2212], [0x2215, 0x2215], [0xfeff, 0xfeff], [0xfffd, 0xfffd],
];

export function inLatin(codePoint) {
  return LATIN_RANGES.some(([from, to]) => codePoint >= from && codePoint <= to);
}

/**
 * The characters a face draws: its character map without the points that map to the missing
 * glyph (a format 4 map ends with U+FFFF pointing at it, and fontkit lists that one too).
 */
export function charactersOf(font) {
  return font.characterSet.filter((c) => font.glyphForCodePoint(c).id !== 0);
}

/** Sorted code points as a CSS unicode-range: runs of consecutive points become one range. */
export function unicodeRange(codePoints) {
  const sorted = [...new Set(codePoints)].sort((a, b) => a - b);
  const parts = [];
  const hex = (n) => n.toString(16).toUpperCase();
  for (let i = 0; i < sorted.length; ) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    parts.push(i === j ? `U+${hex(sorted[i])}` : `U+${hex(sorted[i])}-${hex(sorted[j])}`);
    i = j + 1;
  }
  return parts.join(', ');
}

async function main() {
  const faces = [];
  for (const face of FACES) {
    const ttf = fs.readFileSync(path.join(root, 'fonts', `${face}.ttf`));
    const all = charactersOf(fontkit.create(ttf));
    const parts = [
      { part: 'latin', points: all.filter(inLatin), preload: true },
      { part: 'extended', points: all.filter((c) => !inLatin(c)), preload: false },
    ];
    for (const { part, points, preload } of parts) {
      const file = `${face}-${part}.woff2`;
      const bytes = await subsetFont(ttf, String.fromCodePoint(...points), { targetFormat: 'woff2' });
      fs.writeFileSync(path.join(root, 'fonts', file), bytes);
      faces.push({ family: face, file, preload, unicodeRange: unicodeRange(points) });
      process.stdout.write(`${file}: ${points.length} characters, ${(bytes.length / 1024).toFixed(1)} KB\n`);
    }
  }
  fs.writeFileSync(path.join(root, 'fonts', 'faces.json'), `${JSON.stringify(faces, null, 2)}\n`);
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname)) await main();
