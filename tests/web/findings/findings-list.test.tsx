import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider, useLocation } from 'react-router-dom';
import { analyzeSetup } from '@shared/analyze';
import { FindingsList } from '@web/features/findings/components/findings-list';
import { fixtureText } from '../models/model-data';

function EditorStandIn() {
  const location = useLocation();
  return <p>editor at {location.search}</p>;
}

function renderList(findings: ReturnType<typeof analyzeSetup>['findings'], modelId?: string) {
  const router = createMemoryRouter(
    [
      { path: '/', element: <FindingsList findings={findings} modelId={modelId} /> },
      { path: '/models/:modelId/edit', element: <EditorStandIn /> },
    ],
    { initialEntries: ['/'] },
  );
  render(<RouterProvider router={router} />);
  return { router, user: userEvent.setup() };
}

describe('Findings list', () => {
  // Straight from the checks, which list a warning before the error on the same line.
  const { findings } = analyzeSetup(fixtureText('invalid/heavy-model-failsafe.yaml'));

  it('puts errors first, each with its severity in words, message, hint, path and line:column', () => {
    renderList(findings);
    const items = screen.getAllByRole('listitem');
    expect(items).toHaveLength(findings.length);
    const severities = items.map((item) => within(item).getByText(/^(Error|Warning|Info)$/).textContent);
    const rank = { Error: 0, Warning: 1, Info: 2 } as Record<string, number>;
    expect(findings.map((finding) => finding.severity)).toEqual(['warning', 'error']);
    expect(severities).toEqual(['Error', 'Warning']);
    expect(severities.map((word) => rank[word])).toEqual([...severities.map((word) => rank[word])].sort());

    const unrouted = findings.find((finding) => finding.rule === 'heavy-model-failsafe')!;
    const item = items.find((candidate) => candidate.textContent?.includes(unrouted.message))!;
    expect(item).toHaveTextContent('Error');
    expect(item).toHaveTextContent(unrouted.hint);
    expect(item).toHaveTextContent(unrouted.path);
    expect(item).toHaveTextContent(`line ${unrouted.line}:${unrouted.column}`);
  });

  it('opens a finding’s line in the editor', async () => {
    const { router, user } = renderList(findings, 'model-7');
    const unrouted = findings.find((finding) => finding.rule === 'heavy-model-failsafe')!;
    await user.click(
      screen.getByRole('link', { name: new RegExp(unrouted.message.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')) }),
    );
    expect(router.state.location.pathname).toBe('/models/model-7/edit');
    expect(screen.getByText(`editor at ?line=${unrouted.line}`)).toBeInTheDocument();
  });

  it('has no links without a model to open', () => {
    renderList(findings);
    expect(screen.queryByRole('link')).not.toBeInTheDocument();
  });

  it('says so when there is nothing to show', () => {
    renderList([]);
    expect(screen.getByText('No findings')).toBeInTheDocument();
  });
});
