import { useCallback, type Dispatch } from 'react';
import type { LengthRounding, Opening } from '../../geometry';
import { formatLength } from '../../geometry/units';
import { Text } from '../ui/Text';
import type { EditorAction } from './editorState';
import { lengthReaders, wholeReader } from './fieldReaders';
import { MeasureField } from './MeasureField';
import { shapeLocalBox, shapeWithSize } from './openingShapes';

interface Props {
  opening: Opening;
  rounding: LengthRounding;
  dispatch: Dispatch<EditorAction>;
  editable: boolean;
}

/** The size fields that fit the opening's shape: width and height, a diameter, sides and size across. */
export function OpeningSizeFields({ opening, rounding, dispatch, editable }: Props) {
  const show = useCallback((v: number) => formatLength(v, rounding), [rounding]);
  const showWhole = useCallback((v: number) => String(v), []);
  const { positiveLength, nonNegativeLength } = lengthReaders(rounding);
  const { shape, id } = opening;
  const patchShape = (next: Opening['shape']) => dispatch({ type: 'patch', id, changes: { shape: next } });
  const common = { show, editable };

  switch (shape.kind) {
    case 'circle':
      return (
        <MeasureField {...common} label="Diameter" value={2 * shape.radius} read={positiveLength} testID="field-diameter"
          onCommit={(d) => patchShape({ kind: 'circle', radius: d / 2 })} />
      );
    case 'regularPolygon':
      return (
        <>
          <MeasureField {...common} label="Sides" value={shape.sides} show={showWhole} read={wholeReader(3, 64)} testID="field-sides"
            onCommit={(sides) => patchShape({ ...shape, sides })} />
          <MeasureField {...common} label="Across the corners" value={2 * shape.radius} read={positiveLength} testID="field-across"
            onCommit={(d) => patchShape({ ...shape, radius: d / 2 })} />
        </>
      );
    case 'outline':
      return <Text variant="caption">A traced outline keeps the garment's real size; change the room around it below.</Text>;
    default: {
      const box = shapeLocalBox(shape);
      return (
        <>
          <MeasureField {...common} label="Width" value={box.w} read={positiveLength} testID="field-width"
            onCommit={(w) => patchShape(shapeWithSize(shape, w, box.h, box))} />
          <MeasureField {...common} label="Height" value={box.h} read={positiveLength} testID="field-height"
            onCommit={(h) => patchShape(shapeWithSize(shape, box.w, h, box))} />
          {shape.kind === 'roundedRectangle' ? (
            <MeasureField {...common} label="Corner radius" value={shape.cornerRadius} read={nonNegativeLength} testID="field-corner"
              onCommit={(r) => patchShape({ ...shape, cornerRadius: r })} />
          ) : null}
        </>
      );
    }
  }
}
