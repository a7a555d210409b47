/**
 * The checked-in font files against the faces they were cut from, read with fontkit
 * (a general-purpose font reader, independent of the harfbuzz subsetter that wrote them):
 * nothing lost, nothing twice, every rule's unicode-range true to its file, the same
 * advance widths as the whole face (so text lays out alike whichever file draws it),
 * and every character the screens' source holds in the preloaded Latin part.
 */
import fs from 'node:fs';
import path from 'node:path';
import * as fontkit from 'fontkit';
import { describe, expect, it } from 'vitest';
import { projectRoot, sourceFiles } from '../features/test/sourceFiles';
// @ts-expect-error plain Node module without types
import { FACES, charactersOf, inLatin, unicodeRange } from './subsetFonts.mjs';

interface FaceFile {
  family: string;
  file: string;
  preload: boolean;
  unicodeRange: string;
}

const faces: FaceFile[] = JSON.parse(fs.readFileSync(path.join(projectRoot, 'fonts', 'faces.json'), 'utf8'));
const open = (file: string) => fontkit.create(fs.readFileSync(path.join(projectRoot, 'fonts', file))) as fontkit.Font;
const charactersIn = (file: string): number[] => charactersOf(open(file));

/** A CSS unicode-range read back into code points ("U+20-7E, U+A0" -> 0x20..0x7E, 0xA0). */
function pointsOf(range: string): number[] {
  return range.split(',').flatMap((part) => {
    const m = /^\s*U\+([0-9A-F]+)(?:-([0-9A-F]+))?\s*$/i.exec(part);
    if (!m) throw new Error(`not a unicode-range part: ${part}`);
    const from = parseInt(m[1]!, 16);
    const to = m[2] ? parseInt(m[2], 16) : from;
    return Array.from({ length: to - from + 1 }, (_, i) => from + i);
  });
}

describe('the Manrope faces split into a preloaded Latin part and the rest', () => {
  it.each(FACES as string[])('%s: the two files together hold every character of the face, none twice', (face) => {
    const whole = new Set(charactersIn(`${face}.ttf`));
    const latin = charactersIn(`${face}-latin.woff2`);
    const extended = charactersIn(`${face}-extended.woff2`);
    expect(latin.filter((c) => extended.includes(c))).toEqual([]);
    expect(new Set([...latin, ...extended])).toEqual(whole);
    expect(latin.every(inLatin)).toBe(true);
    expect(extended.some(inLatin)).toBe(false);
    // A customer's name in Polish, Vietnamese, Greek or Cyrillic is drawn by the second file.
    for (const c of 'ŁŻćễΩЖ') expect(extended).toContain(c.codePointAt(0));
  });

  it.each(FACES as string[])('%s: every glyph keeps the advance width it has in the whole face', (face) => {
    const whole = open(`${face}.ttf`);
    for (const part of ['latin', 'extended']) {
      const cut = open(`${face}-${part}.woff2`);
      for (const c of charactersOf(cut) as number[]) {
        expect(cut.glyphForCodePoint(c).advanceWidth, `${part} U+${c.toString(16)}`).toBe(whole.glyphForCodePoint(c).advanceWidth);
      }
    }
  });

  it('gives each file a rule whose unicode-range is exactly the characters the file holds', () => {
    expect(faces).toHaveLength(2 * FACES.length);
    for (const f of faces) {
      expect(f.family).toBe(f.file.replace(/-(latin|extended)\.woff2$/, ''));
      expect(new Set(pointsOf(f.unicodeRange))).toEqual(new Set(charactersIn(f.file)));
      expect(f.preload).toBe(f.file.endsWith('-latin.woff2'));
    }
  });

  it('has in the preloaded part every character the screens are written with that the face has', () => {
    const used = new Set<number>();
    for (const file of sourceFiles('app', 'features', 'geometry')) {
      for (const c of fs.readFileSync(file, 'utf8')) if (c.codePointAt(0)! > 0x7e) used.add(c.codePointAt(0)!);
    }
    expect(used.has('·'.codePointAt(0)!)).toBe(true);
    for (const face of FACES as string[]) {
      const whole = charactersIn(`${face}.ttf`);
      const latin = new Set(charactersIn(`${face}-latin.woff2`));
      const missing = [...used].filter((c) => whole.includes(c) && !latin.has(c)).map((c) => String.fromCodePoint(c));
      expect(missing, face).toEqual([]);
    }
  });

  it('writes a unicode-range that expands back to the same points, runs joined', () => {
    // Brute force: random sets of code points written as ranges and read back.
    let seed = 7;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31);
    for (let round = 0; round < 200; round++) {
      const points = Array.from({ length: 1 + (next() % 40) }, () => next() % 600);
      const range: string = unicodeRange(points);
      expect(pointsOf(range).sort((a, b) => a - b)).toEqual([...new Set(points)].sort((a, b) => a - b));
      // No two parts touch: a run is always written as one range.
      const parts = range.split(', ').map((p) => pointsOf(p));
      for (let i = 1; i < parts.length; i++) expect(parts[i]![0]! - parts[i - 1]!.at(-1)!).toBeGreaterThan(1);
    }
    expect(unicodeRange([0x41, 0x42, 0x43, 0x45])).toBe('U+41-43, U+45');
  });
});
