import type { Finding, FindingCode } from '../../geometry';

/** How urgent a finding is, in the words the checks panel uses. */
export type FindingTone = 'must' | 'look' | 'note';

export function findingTone(severity: Finding['severity']): FindingTone {
  return severity === 'error' ? 'must' : severity === 'warning' ? 'look' : 'note';
}

export const toneLabels: Record<FindingTone, string> = {
  must: 'Fix before cutting',
  look: 'Worth a look',
  note: 'Note',
};

/** A short heading for each kind of finding; the geometry's message gives the detail. */
export const findingTitles: Record<FindingCode, string> = {
  'bridge-narrow': 'Narrow bridge',
  'strip-narrow': 'Thin strip of board',
  'band-narrow': 'Thin reveal band',
  'openings-overlap': 'Openings overlap',
  'opening-outside-mat': 'Opening past the edge',
  'piece-not-covered': 'Opening larger than its piece',
  'overlap-small': 'Small overlap on the piece',
  'piece-larger-than-opening': 'Piece larger than its opening',
  'layout-larger-than-sheet': 'Larger than the board sheet',
  'layout-larger-than-rabbet': 'Too large for the frame',
  'shape-degenerate': 'Opening cannot be cut',
  'shape-too-detailed': 'Outline too spiky to cut',
  'shape-self-intersecting': 'Outline crosses itself',
};
