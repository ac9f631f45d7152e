import { render, screen } from '@testing-library/react';
import { ReviewStateBadge, SeverityBadge } from '@web/components/ui/badge';

describe('Badge', () => {
  it.each([
    ['error', 'Error'],
    ['warning', 'Warning'],
    ['info', 'Note'],
  ] as const)('shows the %s severity as an icon and the word %s', (severity, word) => {
    const { container } = render(<SeverityBadge severity={severity} />);
    const badge = container.firstElementChild as HTMLElement;
    expect(badge).toHaveTextContent(word);
    const icon = badge.querySelector('svg');
    expect(icon).not.toBeNull();
    expect(icon).toHaveAttribute('aria-hidden', 'true');
  });

  it('draws a different icon for each severity so colour is not the only difference', () => {
    const drawings = (['error', 'warning', 'info'] as const).map((severity) => {
      const { container, unmount } = render(<SeverityBadge severity={severity} />);
      const drawing = container.querySelector('svg')?.innerHTML;
      unmount();
      return drawing;
    });
    expect(new Set(drawings).size).toBe(3);
  });

  it('counts findings in words', () => {
    render(
      <>
        <SeverityBadge severity="error" count={1} />
        <SeverityBadge severity="warning" count={3} />
        <SeverityBadge severity="info" count={0} />
      </>,
    );
    expect(screen.getByText('1 error')).toBeInTheDocument();
    expect(screen.getByText('3 warnings')).toBeInTheDocument();
    expect(screen.getByText('0 notes')).toBeInTheDocument();
  });

  it.each([
    ['none', 'Not reviewed'],
    ['pending', 'Review pending'],
    ['approved', 'Approved'],
    ['stale', 'Approval stale'],
    ['changes-requested', 'Changes requested'],
  ] as const)('names the review state %s as "%s" beside an icon', (state, word) => {
    const { container } = render(<ReviewStateBadge state={state} />);
    expect(container).toHaveTextContent(word);
    expect(container.querySelector('svg')).not.toBeNull();
  });
});
