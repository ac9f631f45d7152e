import { RangeSet, StateEffect, StateField, type Extension } from '@codemirror/state';
import { gutter, GutterMarker } from '@codemirror/view';

// Open comment threads beside their line: a gutter of its own next to the checks'
// marks, one marker per line however many threads are on it. Its title reads the
// threads' first words; the Checks panel lists the same threads for keyboard users.

export interface CommentMark {
  line: number;
  title: string;
}

class CommentMarker extends GutterMarker {
  constructor(readonly title: string) {
    super();
  }

  override eq(other: GutterMarker): boolean {
    return other instanceof CommentMarker && other.title === this.title;
  }

  override toDOM(): Node {
    const mark = document.createElement('span');
    mark.className = 'cm-comment-mark';
    mark.title = this.title;
    mark.textContent = '\u275D';
    return mark;
  }
}

export const setCommentMarks = StateEffect.define<CommentMark[]>();

const commentMarks = StateField.define<RangeSet<GutterMarker>>({
  create: () => RangeSet.empty,
  update(marks, transaction) {
    let next = marks.map(transaction.changes);
    for (const effect of transaction.effects) {
      if (!effect.is(setCommentMarks)) continue;
      const doc = transaction.state.doc;
      next = RangeSet.of(
        effect.value
          .filter((mark) => mark.line >= 1 && mark.line <= doc.lines)
          .map((mark) => new CommentMarker(mark.title).range(doc.line(mark.line).from)),
        true,
      );
    }
    return next;
  },
});

export function commentGutter(): Extension {
  return [commentMarks, gutter({ class: 'cm-comment-gutter', markers: (view) => view.state.field(commentMarks) })];
}
