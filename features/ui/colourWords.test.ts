import { describe, expect, it } from 'vitest';
import { colourWords } from './colourWords';

describe('colour words', () => {
  // Reference colours are the CSS named colours (CSS Color Module Level 4, section 6.1),
  // whose names say what a reader should see.
  it.each([
    ['#FFFFFF', 'white'],
    ['#fffaf0', 'white'], // floralwhite
    ['#000000', 'black'],
    ['#808080', 'grey'],
    ['#D3D3D3', 'light grey'], // lightgrey
    ['#2F4F4F', 'dark teal-grey'], // darkslategray: hue 180, saturation 0.25, lightness 0.25
    ['#FF0000', 'red'],
    ['#8B0000', 'dark red'], // darkred
    ['#000080', 'dark blue'], // navy
    ['#008000', 'dark green'], // green: lightness 0.25
    ['#FFA500', 'orange'],
    ['#800080', 'dark purple'], // purple: lightness 0.25
    ['#F5F5DC', 'cream'], // beige
    ['#ADD8E6', 'light blue'], // lightblue
  ])('%s reads as %s', (hex, words) => {
    expect(colourWords(hex)).toBe(words);
  });

  it('reads three-digit codes like six-digit ones and names nonsense plainly', () => {
    expect(colourWords('#fff')).toBe('white');
    expect(colourWords('#f00')).toBe(colourWords('#ff0000'));
    expect(colourWords('not a colour')).toBe('an unnamed colour');
  });
});
