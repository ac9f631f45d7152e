import { parseDocument } from 'yaml';
import { applyEdits, readDocumentData, UnreadableTextError } from '@shared/edit/document-edits';

const setup = `# Two receivers; the wing unit was copied from the fuselage one.
format: bindery-setup/1
link:
  channels: 16                # the link's current mode
receivers:
  - id: fuselage
    outputs: 8
    map:
      - { pin: 1, ch: 1, failsafe: 1500 }
      - { pin: 2, ch: 2 }
  - id: wing
    label: Wing receiver
    outputs: 8
    telemetry: false          # only the fuselage unit reports
    map:
      - { pin: 1, ch: 1,  failsafe: 1500 }
      - { pin: 2, ch: 2,  failsafe: hold }   # landing light stays put
      - pin: 3
        ch: 3
`;

const data = (text: string) => parseDocument(text).toJS();

describe('document edits', () => {
  it('changes one value in place and leaves every other byte as written', () => {
    const out = applyEdits(setup, [{ kind: 'set', path: ['receivers', 1, 'map', 0, 'ch'], value: 9 }]);
    expect(out).toBe(setup.replace('{ pin: 1, ch: 1,  failsafe: 1500 }', '{ pin: 1, ch: 9,  failsafe: 1500 }'));
  });

  it('adds a key to a flow entry before its closing brace', () => {
    const out = applyEdits(setup, [{ kind: 'set', path: ['receivers', 0, 'map', 1, 'failsafe'], value: 'hold' }]);
    expect(out).toBe(setup.replace('{ pin: 2, ch: 2 }', '{ pin: 2, ch: 2, failsafe: hold }'));
  });

  it('removes a key with its comma and keeps the comment after the entry', () => {
    const out = applyEdits(setup, [{ kind: 'delete', path: ['receivers', 1, 'map', 1, 'failsafe'] }]);
    expect(out).toContain('      - { pin: 2, ch: 2 }   # landing light stays put\n');
    expect(data(out).receivers[1].map[1]).toEqual({ pin: 2, ch: 2 });
  });

  it('appends a list entry in the flow style of its siblings, at their indentation', () => {
    const out = applyEdits(setup, [{ kind: 'append', path: ['receivers', 0, 'map'], value: { pin: 3, ch: 3 } }]);
    expect(out).toBe(
      setup.replace('      - { pin: 2, ch: 2 }\n', '      - { pin: 2, ch: 2 }\n      - { pin: 3, ch: 3 }\n'),
    );
  });

  it('appends after a block entry in block style', () => {
    const out = applyEdits(setup, [
      { kind: 'append', path: ['receivers', 1, 'map'], value: { pin: 4, ch: 4, failsafe: 1500 } },
    ]);
    expect(out.endsWith('      - pin: 3\n        ch: 3\n      - pin: 4\n        ch: 4\n        failsafe: 1500\n')).toBe(
      true,
    );
  });

  it('removes a list entry line and keeps the others', () => {
    const out = applyEdits(setup, [{ kind: 'delete', path: ['receivers', 0, 'map', 0] }]);
    expect(out).toBe(setup.replace('      - { pin: 1, ch: 1, failsafe: 1500 }\n', ''));
  });

  it('leaves an empty list, not a null, when the last entry goes', () => {
    const once = applyEdits(setup, [
      { kind: 'delete', path: ['receivers', 0, 'map', 1] },
      { kind: 'delete', path: ['receivers', 0, 'map', 0] },
    ]);
    expect(data(once).receivers[0].map).toEqual([]);
    expect(once).toContain('# Two receivers; the wing unit was copied from the fuselage one.');
  });

  it('adds a missing key to a block mapping at its indentation', () => {
    const out = applyEdits(setup, [{ kind: 'set', path: ['receivers', 0, 'telemetry'], value: true }]);
    expect(out).toContain(
      '    outputs: 8\n    map:\n      - { pin: 1, ch: 1, failsafe: 1500 }\n      - { pin: 2, ch: 2 }\n    telemetry: true\n  - id: wing',
    );
  });

  it('inserts a list entry between two others on a line of its own, the comment staying with its entry', () => {
    const out = applyEdits(setup, [
      { kind: 'insert', path: ['receivers', 1, 'map', 1], value: { pin: 5, ch: 5, failsafe: 1500 } },
    ]);
    expect(out).toBe(
      setup.replace(
        '      - { pin: 2, ch: 2,  failsafe: hold }',
        '      - { pin: 5, ch: 5, failsafe: 1500 }\n      - { pin: 2, ch: 2,  failsafe: hold }',
      ),
    );
    const first = applyEdits(setup, [{ kind: 'insert', path: ['receivers', 0, 'map', 0], value: { pin: 9, ch: 9 } }]);
    expect(first).toBe(
      setup.replace(
        '      - { pin: 1, ch: 1, failsafe: 1500 }',
        '      - { pin: 9, ch: 9 }\n      - { pin: 1, ch: 1, failsafe: 1500 }',
      ),
    );
  });

  it('inserts into a flow list before the entry at the index, and appends at its end', () => {
    const text = 'rates: { weights: [100, 60] }   # high, low\n';
    expect(applyEdits(text, [{ kind: 'insert', path: ['rates', 'weights', 1], value: 80 }])).toBe(
      'rates: { weights: [100, 80, 60] }   # high, low\n',
    );
    expect(applyEdits(text, [{ kind: 'insert', path: ['rates', 'weights', 2], value: 30 }])).toBe(
      'rates: { weights: [100, 60, 30] }   # high, low\n',
    );
  });

  it('quotes a string that would read back as something else', () => {
    const out = applyEdits(setup, [{ kind: 'set', path: ['receivers', 1, 'label'], value: 'Wing, left: red' }]);
    expect(data(out).receivers[1].label).toBe('Wing, left: red');
    const flow = applyEdits(setup, [{ kind: 'set', path: ['receivers', 0, 'map', 0, 'note'], value: '1500' }]);
    expect(data(flow).receivers[0].map[0].note).toBe('1500');
  });

  it('falls back to the Document serialisation when no splice fits, with the same meaning', () => {
    // Removing the first key of a block list item would take the dash with it.
    const out = applyEdits(setup, [{ kind: 'delete', path: ['receivers', 1, 'map', 2, 'pin'] }]);
    expect(data(out).receivers[1].map[2]).toEqual({ ch: 3 });
    expect(out).toContain('# only the fuselage unit reports');
  });

  it('refuses to edit text with syntax errors', () => {
    expect(() => applyEdits('a: [1, 2', [{ kind: 'set', path: ['a'], value: 1 }])).toThrow(UnreadableTextError);
    expect(readDocumentData('a: [1, 2')).toBeNull();
    expect(readDocumentData('a: 1')).toEqual({ a: 1 });
  });
});
