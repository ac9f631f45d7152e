import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { vi } from 'vitest';
import { NumberField } from '@web/features/editor/components/number-field';

// The one number field of the Controls-and-link, channel plan and pin-map forms.

function field(props: Partial<Parameters<typeof NumberField>[0]> = {}) {
  const onEdits = vi.fn();
  render(
    <NumberField
      label="Channels the link carries"
      value={8}
      path={['link', 'channels']}
      min={4}
      max={32}
      what="The channel count"
      onEdits={onEdits}
      {...props}
    />,
  );
  return { onEdits, input: screen.getByLabelText('Channels the link carries'), user: userEvent.setup() };
}

describe('NumberField', () => {
  it('writes a whole number in range at its path when left, and refuses one out of range beside the field', async () => {
    const { onEdits, input, user } = field();
    await user.clear(input);
    await user.type(input, '40');
    await user.tab();
    expect(onEdits).not.toHaveBeenCalled();
    expect(screen.getByText('The channel count is a whole number from 4 to 32.')).toBeInTheDocument();
    await user.clear(input);
    await user.type(input, '12');
    await user.tab();
    expect(onEdits).toHaveBeenCalledWith([{ kind: 'set', path: ['link', 'channels'], value: 12 }]);
    expect(screen.queryByText(/is a whole number/)).not.toBeInTheDocument();
  });

  it('takes a decimal when asked, and removes an optional number that is emptied', async () => {
    const { onEdits, input, user } = field({ decimal: true, optional: true, value: 150, min: 1, max: 10_000 });
    await user.clear(input);
    await user.type(input, '62.5');
    await user.tab();
    expect(onEdits).toHaveBeenLastCalledWith([{ kind: 'set', path: ['link', 'channels'], value: 62.5 }]);
    await user.clear(input);
    await user.tab();
    expect(onEdits).toHaveBeenLastCalledWith([{ kind: 'delete', path: ['link', 'channels'] }]);
  });

  it('refuses an emptied number that is not optional', async () => {
    const { onEdits, input, user } = field();
    await user.clear(input);
    await user.tab();
    expect(onEdits).not.toHaveBeenCalled();
    expect(screen.getByText('The channel count is a whole number from 4 to 32.')).toBeInTheDocument();
  });
});
