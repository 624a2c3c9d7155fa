// @vitest-environment happy-dom
import type { Offer } from '@scrap-relay/shared';
import { QueryClientProvider } from '@tanstack/react-query';
import { act } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { createQueryClient } from '../../../lib/react-query.ts';
import { jsonResponse, makeSession, makeUser } from '../../../testing/fixtures.ts';
import { buttonNamed, byLabel, cleanup, click, render, waitFor } from '../../../testing/render.tsx';
import { DecisionDone } from './decision-done.tsx';
import { ReviewDecisionForm, type ReviewOutcome } from './review-decision-form.tsx';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The session (for the CSRF token) and the review endpoint, recording what was decided. */
function serveReview() {
  const decisions: unknown[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      const path = new URL(String(input), 'http://app.test').pathname;
      if (path === '/api/session') return jsonResponse(200, makeSession(makeUser({ roles: ['member', 'librarian'] })));
      if (path === '/api/bundles/b-7/review' && init?.method === 'POST') {
        decisions.push(JSON.parse(String(init.body)));
        return jsonResponse(200, { bundle: null });
      }
      return jsonResponse(404, { error: { code: 'not_found', message: 'Not here.' } });
    }),
  );
  return decisions;
}

async function renderForm(offer?: Offer) {
  const decided = vi.fn((_outcome: ReviewOutcome) => undefined);
  const rendered = await render(
    <QueryClientProvider client={createQueryClient()}>
      <ReviewDecisionForm bundleId="b-7" title="Feed-sack prints" offer={offer} onDecided={decided} />
    </QueryClientProvider>,
  );
  return { decided, ...rendered };
}

async function typeNotes(textarea: HTMLTextAreaElement, value: string) {
  const setter = Object.getOwnPropertyDescriptor(HTMLTextAreaElement.prototype, 'value')?.set;
  await act(async () => {
    setter?.call(textarea, value);
    textarea.dispatchEvent(new Event('input', { bubbles: true }));
  });
}

describe('the review decision', () => {
  it('will not return a bundle without notes for the member', async () => {
    const decisions = serveReview();
    const { container, decided } = await renderForm();

    await click(buttonNamed(container, 'Return with notes'));

    const notes = byLabel<HTMLTextAreaElement>(container, 'Notes for the member');
    await waitFor(() => expect(notes.getAttribute('aria-invalid')).toBe('true'));
    expect(container.textContent).toContain('Tell the member what to change.');
    expect(decisions).toEqual([]);
    expect(decided).not.toHaveBeenCalled();
  });

  it('returns with the notes, and says which decision was made', async () => {
    const decisions = serveReview();
    const { container, decided } = await renderForm();

    await typeNotes(byLabel<HTMLTextAreaElement>(container, 'Notes for the member'), 'Please weigh the bag again.');
    await click(buttonNamed(container, 'Return with notes'));

    await waitFor(() => expect(decided).toHaveBeenCalledWith({ decision: 'return', title: 'Feed-sack prints', offer: null }));
    expect(decisions).toEqual([{ decision: 'return', notes: 'Please weigh the bag again.' }]);
  });

  it('approves without notes', async () => {
    const decisions = serveReview();
    const { container, decided } = await renderForm();

    await click(buttonNamed(container, 'Approve: put it on the shelf'));

    await waitFor(() => expect(decided).toHaveBeenCalledWith({ decision: 'approve', title: 'Feed-sack prints', offer: null }));
    expect(decisions).toEqual([{ decision: 'approve' }]);
  });

  it('approves a starter bundle for the waiting list, and says so afterwards instead of "on the shelf"', async () => {
    const decisions = serveReview();
    const { container, decided } = await renderForm('starter');

    await click(buttonNamed(container, 'Approve: offer it to new quilters'));

    await waitFor(() => expect(decided).toHaveBeenCalledWith({ decision: 'approve', title: 'Feed-sack prints', offer: 'starter' }));
    expect(decisions).toEqual([{ decision: 'approve' }]);

    const done = await render(<DecisionDone outcome={decided.mock.calls[0]![0]} />);
    expect(done.container.textContent).toContain('Approved “Feed-sack prints”');
    expect(done.container.textContent).toContain('offered to the new quilter who has waited longest on the waiting list');
    expect(done.container.textContent).not.toContain('on the shelf');
    expect(done.container.textContent).not.toContain('wish');
  });

  it('says an approved sale bundle is on the shelf and matching wishes were told', async () => {
    const { container } = await render(<DecisionDone outcome={{ decision: 'approve', title: 'Feed-sack prints', offer: 'sale' }} />);
    expect(container.textContent).toContain('It is on the shelf now.');
    expect(container.textContent).toContain('every member whose wish it matches');
  });
});
