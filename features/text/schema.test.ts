import { describe, expect, it } from 'vitest';
import { findControlCharacter, hasControlCharacter, optionalTextField, secretField, textField } from './schema';

// Control characters as Unicode defines them (general category Cc): U+0000-U+001F, U+007F-U+009F.
const everyControl = [...Array.from({ length: 0x20 }, (_, i) => i), ...Array.from({ length: 0x21 }, (_, i) => 0x7f + i)].map((c) => String.fromCharCode(c));

describe('text fields', () => {
  it('every Unicode control character (category Cc) is refused in a one-line field, checked against \\p{Cc}', () => {
    const field = textField({ max: 50 });
    for (const c of everyControl) {
      expect(/\p{Cc}/u.test(c)).toBe(true);
      expect(field.safeParse(`a${c}b`).success).toBe(false);
    }
    expect(field.safeParse('Harbour navy – 4-ply, “museum” é').success).toBe(true);
  });

  it('multi-line text keeps line feed, carriage return and tab, and refuses the other controls', () => {
    const notes = optionalTextField({ max: 100, multiline: true });
    expect(notes.parse('one\r\ntwo\tthree')).toBe('one\r\ntwo\tthree');
    expect(notes.safeParse('one\u0000two').success).toBe(false);
    expect(notes.parse('   ')).toBeNull();
    expect(hasControlCharacter('a\nb', true)).toBe(false);
    expect(hasControlCharacter('a\nb', false)).toBe(true);
  });

  it('trims, and checks the length after trimming', () => {
    const name = textField({ max: 5, required: 'Enter a name' });
    expect(name.parse('  Otto  ')).toBe('Otto');
    expect(name.safeParse('   ').error?.issues[0]?.message).toBe('Enter a name');
    expect(name.safeParse('Ottoline').success).toBe(false);
  });

  it('a password keeps its spaces but not control characters', () => {
    const password = secretField({ min: 3, max: 20, required: 'Enter a password' });
    expect(password.parse('  two words  ')).toBe('  two words  ');
    expect(password.safeParse('abc\u0000def').success).toBe(false);
  });

  it('finds the path of a control character in a JSON document, keys included', () => {
    expect(findControlCharacter({ mats: [{ name: 'ok' }, { name: 'x\u0007' }] })).toEqual(['mats', 1, 'name']);
    expect(findControlCharacter({ ['bad\u0000key']: 1 })).toEqual(['bad\u0000key']);
    expect(findControlCharacter({ notes: 'line\nbreak', n: 3 })).toBeNull();
  });
});
