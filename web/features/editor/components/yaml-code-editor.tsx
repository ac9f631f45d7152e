import { yaml } from '@codemirror/lang-yaml';
import { lintGutter, setDiagnostics } from '@codemirror/lint';
import type { EditorState, Extension } from '@codemirror/state';
import CodeMirror, { EditorSelection, EditorView } from '@uiw/react-codemirror';
import { useEffect, useMemo, useRef, useState } from 'react';
import type { Finding } from '@shared/findings';
import { findingDiagnostics } from '../finding-diagnostics';
import { editorTheme } from './code-editor-theme';
import type { LineOrigin } from '../line-origins';
import { commentGutter, setCommentMarks, type CommentMark } from './comment-gutter';
import { originGutter, originOnLine, setOriginMarks } from './origin-gutter';

/** A request to show a line: `key` changes with every request, so the same line can be asked for twice. */
export interface LineJump {
  line: number;
  key: string;
}

export interface YamlCodeEditorProps {
  value: string;
  onChange: (value: string) => void;
  readOnly: boolean;
  /** The findings and the text they were computed for; marks follow only when that text is on show. */
  checked: { text: string; findings: readonly Finding[] };
  jump: LineJump | null;
  /** False while another tab covers the editor: a jump waits until it shows. */
  visible: boolean;
  label: string;
  /** Open comment threads beside their lines, for the text on show. */
  comments: { text: string; marks: readonly CommentMark[] };
  /** The revision each line came from, for the text on show; null while the pilot has them hidden. */
  origins: { text: string; marks: readonly LineOrigin[] } | null;
  /** The cursor's line and its mark, each time either changes: the gutter's detail for keyboard users. Keep it stable (a state setter): a new one reconfigures the editor. */
  onCursorOrigin?: (cursor: CursorOrigin) => void;
}

export interface CursorOrigin {
  line: number;
  origin: LineOrigin | null;
}

const BASIC_SETUP = { autocompletion: false, foldGutter: true, highlightActiveLine: true, tabSize: 2 } as const;

// Tells the cursor's line and that line's origin mark whenever either changes: a move,
// an edit that takes a mark away, or new marks.
function cursorOrigin(tell: (cursor: CursorOrigin) => void): Extension {
  let last = '';
  const report = (state: EditorState) => {
    const line = state.doc.lineAt(state.selection.main.head).number;
    const origin = originOnLine(state, line);
    const key = `${line} ${origin?.title ?? ''}`;
    if (key === last) return;
    last = key;
    tell({ line, origin });
  };
  return EditorView.updateListener.of((update) => report(update.state));
}

// Loaded on demand (see setup-editor.tsx), so CodeMirror stays out of the first page.
export function YamlCodeEditor({
  value,
  onChange,
  readOnly,
  checked,
  jump,
  visible,
  label,
  comments,
  origins,
  onCursorOrigin,
}: YamlCodeEditorProps) {
  const [view, setView] = useState<EditorView | null>(null);
  const shownJump = useRef<string | null>(null);

  const extensions = useMemo(
    () => [
      yaml(),
      lintGutter(),
      commentGutter(),
      originGutter(),
      EditorView.lineWrapping,
      ...(onCursorOrigin ? [cursorOrigin(onCursorOrigin)] : []),
      // The editable text is already a tab stop; saying so lets checkers see that the
      // scrolling area around it is reachable by keyboard.
      EditorView.contentAttributes.of({ 'aria-label': label, tabindex: '0' }),
    ],
    [label, onCursorOrigin],
  );

  // Marks and jumps wait for the view, and for the text they belong to: `value` reaches
  // the view in the wrapper's own effect, so each effect here runs again as it changes.
  useEffect(() => {
    if (!view) return;
    if (view.state.doc.toString() !== checked.text) return;
    view.dispatch(setDiagnostics(view.state, findingDiagnostics(view.state.doc, checked.findings)));
  }, [view, checked, value]);

  useEffect(() => {
    if (!view) return;
    if (view.state.doc.toString() !== comments.text) return;
    view.dispatch({ effects: setCommentMarks.of([...comments.marks]) });
  }, [view, comments, value]);

  useEffect(() => {
    if (!view) return;
    if (origins && view.state.doc.toString() !== origins.text) return;
    view.dispatch({ effects: setOriginMarks.of(origins ? [...origins.marks] : []) });
  }, [view, origins, value]);

  useEffect(() => {
    if (!view || !visible || !jump || shownJump.current === jump.key) return;
    shownJump.current = jump.key;
    const doc = view.state.doc;
    const line = doc.line(Math.min(Math.max(1, jump.line), doc.lines));
    // The cursor goes to the start of the line, not a selection of it: the next
    // keystroke adds to the line rather than replacing it.
    view.dispatch({
      selection: EditorSelection.cursor(line.from),
      effects: EditorView.scrollIntoView(line.from, { y: 'center' }),
    });
    view.focus();
  }, [view, visible, jump, value]);

  useEffect(() => {
    if (view && visible) view.requestMeasure();
  }, [view, visible]);

  return (
    <CodeMirror
      value={value}
      onChange={onChange}
      readOnly={readOnly}
      editable={!readOnly}
      basicSetup={BASIC_SETUP}
      theme={editorTheme}
      onCreateEditor={setView}
      extensions={extensions}
      height="100%"
      className="h-full"
    />
  );
}
