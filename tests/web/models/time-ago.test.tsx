import { render } from '@testing-library/react';
import { TimeAgo } from '@web/features/models/components/time-ago';

// A moment years before any run of these tests, so it is always shown as a date.
const LONG_AGO = '2020-06-09T12:00:00.000Z';

describe('TimeAgo', () => {
  it('shows an old time as its date, with the exact moment in the tooltip and the machine-readable time', () => {
    const { container } = render(<TimeAgo iso={LONG_AGO} />);
    const time = container.querySelector('time')!;
    expect(time).toHaveAttribute('datetime', LONG_AGO);
    expect(time.textContent).toMatch(/2020/);
    expect(time.textContent).not.toMatch(/ago/);
    expect(time.getAttribute('title')).toMatch(/2020.*\d{1,2}:00/);
    expect(container.textContent).toBe(time.textContent);
  });

  it('reads “on <date>” in a sentence, and a recent time without “on”', () => {
    expect(render(<TimeAgo iso={LONG_AGO} inSentence />).container.textContent).toMatch(/^on .*2020$/);
    expect(render(<TimeAgo iso={new Date().toISOString()} inSentence />).container.textContent).not.toMatch(/^on /);
  });
});
