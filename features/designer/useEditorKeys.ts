import type { Dispatch } from 'react';
import type { EditorAction } from './editorState';

/** Native screens have no keyboard shortcuts; every action has a button. */
export function useEditorKeys(_dispatch: Dispatch<EditorAction>, _editable: boolean): void {}
