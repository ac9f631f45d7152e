import { EditorView } from '@codemirror/view';
import { act } from '@testing-library/react';

// jsdom lays nothing out, and its Range has no client rectangles, which CodeMirror
// asks for when it measures the text it draws. Empty rectangles say "nothing drawn
// here", which is true in jsdom; the document and its transactions are unaffected.
const emptyRects = (): DOMRectList => Object.assign([], { item: () => null });
const emptyRect = (): DOMRect => ({
  x: 0,
  y: 0,
  width: 0,
  height: 0,
  top: 0,
  right: 0,
  bottom: 0,
  left: 0,
  toJSON: () => ({}),
});
if (!Range.prototype.getClientRects) Range.prototype.getClientRects = emptyRects;
if (!Range.prototype.getBoundingClientRect) Range.prototype.getBoundingClientRect = emptyRect;

/** The real CodeMirror view the Edit screen drew. */
export function editorView(): EditorView {
  const element = document.querySelector<HTMLElement>('.cm-editor');
  const view = element && EditorView.findFromDOM(element);
  if (!view) throw new Error('No CodeMirror editor on the page');
  return view;
}

/** Replaces `find` with `replace` in the editor as typing would: one user input transaction. */
export function typeOver(find: string, replace: string): void {
  const view = editorView();
  const from = view.state.doc.toString().indexOf(find);
  if (from < 0) throw new Error(`The editor text has no "${find}"`);
  act(() => {
    view.dispatch({ changes: { from, to: from + find.length, insert: replace }, userEvent: 'input.type' });
  });
}
