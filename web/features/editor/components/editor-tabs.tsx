import { useRef, type KeyboardEvent } from 'react';
import { cx } from '../../../lib/cx';

export type EditorTab = 'text' | 'controls' | 'plan' | 'pins' | 'mixes';

const TABS: { id: EditorTab; label: string }[] = [
  { id: 'text', label: 'Text' },
  { id: 'controls', label: 'Controls and link' },
  { id: 'plan', label: 'Channel plan' },
  { id: 'pins', label: 'Pin maps' },
  { id: 'mixes', label: 'Mixes' },
];

/** The views of one document: its text and the forms. Arrow keys move between them. */
export function EditorTabs({ value, onChange }: { value: EditorTab; onChange: (tab: EditorTab) => void }) {
  const buttons = useRef<(HTMLButtonElement | null)[]>([]);

  const onKeyDown = (event: KeyboardEvent, index: number) => {
    const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    const to =
      event.key === 'Home'
        ? 0
        : event.key === 'End'
          ? TABS.length - 1
          : step === 0
            ? null
            : (index + step + TABS.length) % TABS.length;
    if (to === null) return;
    event.preventDefault();
    onChange(TABS[to].id);
    buttons.current[to]?.focus();
  };

  return (
    <div role="tablist" aria-label="Ways to edit the setup" className="flex flex-wrap gap-1">
      {TABS.map((tab, index) => {
        const selected = tab.id === value;
        return (
          <button
            key={tab.id}
            ref={(element) => {
              buttons.current[index] = element;
            }}
            type="button"
            role="tab"
            id={`editor-tab-${tab.id}`}
            aria-selected={selected}
            aria-controls={`editor-panel-${tab.id}`}
            tabIndex={selected ? 0 : -1}
            onClick={() => onChange(tab.id)}
            onKeyDown={(event) => onKeyDown(event, index)}
            className={cx(
              'inline-flex h-10 items-center border-b-[3px] px-3 text-base',
              selected
                ? 'border-accent-700 font-semibold text-ink-900'
                : 'border-transparent text-ink-700 hover:border-ply-300 hover:text-ink-900',
            )}
          >
            {tab.label}
          </button>
        );
      })}
    </div>
  );
}
