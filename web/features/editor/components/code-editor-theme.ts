import { HighlightStyle, syntaxHighlighting } from '@codemirror/language';
import { EditorView } from '@codemirror/view';
import { tags } from '@lezer/highlight';

// The YAML editor in Bindery's own colours (web/styles/app.css): paper for the page,
// ink for text, the accent blue for keys, moss for quoted text, comments muted. The
// values repeat the theme's custom properties so the editor reads them at run time.

const chrome = EditorView.theme({
  '&': {
    color: 'var(--color-ink-900)',
    backgroundColor: 'var(--color-paper-raised)',
    fontSize: '0.875rem',
    height: '100%',
  },
  '&.cm-focused': { outline: '3px solid var(--color-accent-600)', outlineOffset: '2px' },
  '.cm-scroller': { fontFamily: 'var(--font-mono)', lineHeight: '1.55' },
  '.cm-content': { caretColor: 'var(--color-ink-900)', padding: '0.5rem 0' },
  '.cm-cursor, .cm-dropCursor': { borderLeftColor: 'var(--color-ink-900)', borderLeftWidth: '2px' },
  '&.cm-focused > .cm-scroller > .cm-selectionLayer .cm-selectionBackground, .cm-selectionBackground, ::selection': {
    backgroundColor: 'rgb(42 95 143 / 0.22)',
  },
  // See-through, so a selection drawn beneath the current line still shows.
  '.cm-activeLine': { backgroundColor: 'rgb(201 183 151 / 0.16)' },
  '.cm-gutters': {
    backgroundColor: 'var(--color-paper)',
    color: 'var(--color-ink-500)',
    borderRight: '1px solid var(--color-ply-200)',
  },
  '.cm-activeLineGutter': { backgroundColor: 'var(--color-ply-100)', color: 'var(--color-ink-900)' },
  '.cm-lineNumbers .cm-gutterElement': { padding: '0 0.5rem 0 0.75rem' },
  // Open comment threads: the accent colour, apart from the checks' severity marks.
  '.cm-comment-gutter .cm-gutterElement': { padding: '0 0.25rem', minWidth: '1.1rem' },
  '.cm-comment-mark': { color: 'var(--color-accent-700)', fontWeight: '700', cursor: 'default' },
  '.cm-origin-gutter .cm-gutterElement': { padding: '0 0.35rem', minWidth: '2.2rem', textAlign: 'right' },
  '.cm-origin-mark': { color: 'var(--color-ink-700)', fontSize: '0.8em', cursor: 'help' },
  '.cm-foldPlaceholder': {
    backgroundColor: 'var(--color-ply-100)',
    border: '1px solid var(--color-ply-300)',
    color: 'var(--color-ink-700)',
  },
  '.cm-tooltip': {
    backgroundColor: 'var(--color-paper-raised)',
    border: '1px solid var(--color-ply-300)',
    borderRadius: 'var(--radius-md)',
    boxShadow: 'var(--shadow-toast)',
    color: 'var(--color-ink-900)',
    fontFamily: 'var(--font-sans)',
    maxWidth: '28rem',
  },
  '.cm-diagnostic': { padding: '0.4rem 0.6rem', fontSize: '0.875rem', lineHeight: '1.35rem' },
  '.cm-diagnostic-error': { borderLeft: '4px solid var(--color-danger-700)' },
  '.cm-diagnostic-warning': { borderLeft: '4px solid var(--color-caution-700)' },
  '.cm-diagnostic-info': { borderLeft: '4px solid var(--color-info-700)' },
  '.cm-diagnosticSource': { color: 'var(--color-ink-500)', fontFamily: 'var(--font-mono)', fontSize: '0.75rem' },
  '.cm-lintRange-error': {
    backgroundImage: 'none',
    textDecoration: 'underline wavy var(--color-danger-700)',
    textUnderlineOffset: '3px',
  },
  '.cm-lintRange-warning': {
    backgroundImage: 'none',
    textDecoration: 'underline wavy var(--color-caution-700)',
    textUnderlineOffset: '3px',
  },
  '.cm-lintRange-info': {
    backgroundImage: 'none',
    textDecoration: 'underline dotted var(--color-info-700)',
    textUnderlineOffset: '3px',
  },
  '.cm-panels': { backgroundColor: 'var(--color-paper)', color: 'var(--color-ink-900)' },
  '.cm-searchMatch': { backgroundColor: 'var(--color-caution-100)', outline: '1px solid var(--color-caution-700)' },
});

const highlight = HighlightStyle.define([
  { tag: tags.definition(tags.propertyName), color: 'var(--color-accent-700)', fontWeight: '500' },
  { tag: tags.content, color: 'var(--color-ink-900)' },
  { tag: [tags.string, tags.special(tags.string)], color: 'var(--color-moss-700)' },
  { tag: tags.lineComment, color: 'var(--color-ink-500)', fontStyle: 'italic' },
  { tag: [tags.separator, tags.punctuation, tags.brace, tags.squareBracket], color: 'var(--color-ply-500)' },
  {
    tag: [tags.labelName, tags.typeName, tags.keyword, tags.meta, tags.attributeValue],
    color: 'var(--color-caution-700)',
  },
]);

export const editorTheme = [chrome, syntaxHighlighting(highlight)];
