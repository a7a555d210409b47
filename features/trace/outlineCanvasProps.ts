import type { Dispatch } from 'react';
import type { BoardPoint } from '../../geometry';
import type { OutlineEdit } from './outlineEdits';

export interface OutlineCanvasProps {
  imageHref: string;
  /** The squared photo's size in inches: the canvas draws one user unit per inch. */
  widthIn: number;
  heightIn: number;
  points: readonly BoardPoint[];
  dispatch: Dispatch<OutlineEdit>;
  selected: number | null;
  onSelect: (index: number | null) => void;
  /** 'nodes' drags and adds nodes; 'move' drags the whole outline. */
  tool: 'nodes' | 'move';
}
