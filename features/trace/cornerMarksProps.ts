import type { BoardPoint } from '../../geometry';

export interface CornerMarksProps {
  photoHref: string;
  widthPx: number;
  heightPx: number;
  /** Marks in pixels of the upright photo: four corners, or two ends of a known distance. */
  marks: BoardPoint[];
  onMarksChange: (marks: BoardPoint[]) => void;
  /** A tapped background point, shown as a ring. */
  background: BoardPoint | null;
  /** When set, a tap on the photo picks the background instead of moving marks. */
  pickingBackground: boolean;
  onBackground: (at: BoardPoint) => void;
  /** Two opposite corners of a rough box round the garment, when the framer drew one. */
  box: BoardPoint[] | null;
  onBoxChange: (box: BoardPoint[]) => void;
}
