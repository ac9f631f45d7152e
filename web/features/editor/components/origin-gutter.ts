import { RangeSet, StateEffect, StateField, type EditorState, type Extension } from '@codemirror/state';
import { gutter, GutterMarker } from '@codemirror/view';
import type { LineOrigin } from '../line-origins';

// "Show where each line came from": a narrow gutter with the revision that last changed
// each line's settings ("r4"); its title reads the author, date and message.

class OriginMarker extends GutterMarker {
  constructor(readonly origin: LineOrigin) {
    super();
  }

  override eq(other: GutterMarker): boolean {
    return other instanceof OriginMarker && other.origin.title === this.origin.title;
  }

  override toDOM(): Node {
    const mark = document.createElement('span');
    mark.className = 'cm-origin-mark';
    mark.title = this.origin.title;
    mark.setAttribute('aria-label', this.origin.title);
    mark.textContent = this.origin.label;
    return mark;
  }
}

export const setOriginMarks = StateEffect.define<LineOrigin[]>();

const originMarks = StateField.define<RangeSet<GutterMarker>>({
  create: () => RangeSet.empty,
  update(marks, transaction) {
    let next = marks.map(transaction.changes);
    // A line being typed on loses its mark at once; the next check says whether it still holds a saved value.
    if (transaction.docChanged) {
      const doc = transaction.state.doc;
      transaction.changes.iterChangedRanges((_fromA, _toA, fromB, toB) => {
        next = next.update({
          filter: () => false,
          filterFrom: doc.lineAt(fromB).from,
          filterTo: doc.lineAt(toB).to,
        });
      });
    }
    for (const effect of transaction.effects) {
      if (!effect.is(setOriginMarks)) continue;
      const doc = transaction.state.doc;
      next = RangeSet.of(
        effect.value
          .filter((origin) => origin.line >= 1 && origin.line <= doc.lines)
          .map((origin) => new OriginMarker(origin).range(doc.line(origin.line).from)),
        true,
      );
    }
    return next;
  },
});

/** The mark on line `line` as the gutter shows it now (edited lines have none), for the cursor's status line. */
export function originOnLine(state: EditorState, line: number): LineOrigin | null {
  const from = state.doc.line(line).from;
  let found: LineOrigin | null = null;
  state.field(originMarks, false)?.between(from, from, (start, _end, marker) => {
    if (start !== from || !(marker instanceof OriginMarker)) return;
    found = marker.origin;
    return false;
  });
  return found;
}

export function originGutter(): Extension {
  return [originMarks, gutter({ class: 'cm-origin-gutter', markers: (view) => view.state.field(originMarks) })];
}
