import { beforeEach, describe, expect, it } from 'vitest';
import { AuditEvent, ReviewVerdict, type Workspace } from '@api/models';
import { CHECKLIST_IDS } from '@api/reviews/checklist';
import { createUser } from './helpers/factories';
import { clubModel, reviewClub, reviewOf as requestReviewOf, type ReviewClub } from './helpers/review-club';
import { useMailTestApp } from './helpers/mail';
import { clientFor, edit, SCALE, saveVia, type Client } from './models-support';

// Deliberate verdicts, the review's comparison base and plan, carried ticks and
// comment threads (issue 16, the review half).

const t = useMailTestApp();

let workspace: Workspace;
let author: Client;
let reviewer: Client;
let second: Client;
let viewer: Client;
let club: ReviewClub;

beforeEach(async () => {
  club = await reviewClub(t);
  ({ workspace, author, reviewer, second, viewer } = club);
});

const UNSET_WING_PIN = (text: string) => edit(text, '{ pin: 1, ch: 9,  failsafe: 1500 }', '{ pin: 1, ch: 9 }');

const model = (yaml = SCALE()) => clubModel(club, { yaml });
const reviewOf = (revisionId: string) => requestReviewOf(club, revisionId);

const tickAll = (reviewId: string, items: readonly string[] = CHECKLIST_IDS) =>
  reviewer.post(`/api/reviews/${reviewId}/verdicts`, {
    verdict: 'comment',
    checklist: Object.fromEntries(items.map((item) => [item, true])),
  });

describe('deliberate verdicts', () => {
  it('asks for a confirmation before approving with unticked items or open warnings, and records what was left', async () => {
    const { revision } = await model(UNSET_WING_PIN(SCALE()));
    const review = await reviewOf(revision.id);
    await tickAll(
      review,
      CHECKLIST_IDS.filter((item) => item !== 'battery-charge' && item !== 'range-check'),
    ).expect(201);

    const refused = await reviewer
      .post(`/api/reviews/${review}/verdicts`, { verdict: 'approve', checklist: { 'range-check': true } })
      .expect(422);
    expect(refused.body.error.code).toBe('confirmation-needed');
    expect(refused.body.error.message).toMatch(/1 checklist item is not ticked and 1 warning is open/);
    expect(refused.body.error.details.left_open).toEqual({
      unticked: [{ id: 'battery-charge', label: 'Battery charge' }],
      warnings: [expect.objectContaining({ rule: 'failsafe-unset', path: 'receivers[id=wing].map[pin=1]' })],
    });
    // Refused whole: no verdict, and the tick sent along was not kept.
    expect(await ReviewVerdict.count({ where: { reviewId: review, verdict: 'approve' } })).toBe(0);
    const before = (await reviewer.get(`/api/reviews/${review}`).expect(200)).body.data;
    expect(before.checklist.find((item: { id: string }) => item.id === 'range-check').ticked).toBe(false);
    expect(before.state).toBe('open');

    const given = await reviewer
      .post(`/api/reviews/${review}/verdicts`, {
        verdict: 'approve',
        checklist: { 'range-check': true },
        confirm_left_open: true,
      })
      .expect(201);
    expect(given.body.data.left_open).toEqual({
      unticked: [{ id: 'battery-charge', label: 'Battery charge' }],
      warnings: [expect.objectContaining({ rule: 'failsafe-unset' })],
    });
    const page = (await viewer.get(`/api/reviews/${review}`).expect(200)).body.data;
    expect(page.state).toBe('approved');
    expect(page.verdicts.at(-1)).toMatchObject({ verdict: 'approve', left_open: given.body.data.left_open });
    const event = await AuditEvent.findOne({
      where: { workspaceId: workspace.id, action: 'review.verdict' },
      order: [['createdAt', 'DESC']],
    });
    expect(event?.details).toMatchObject({ verdict: 'approve', left_open: { unticked: [{ id: 'battery-charge' }] } });
  });

  it('approves without a confirmation when everything is ticked and no warning is open; other verdicts never ask', async () => {
    const { revision } = await model();
    const review = await reviewOf(revision.id);
    await reviewer.post(`/api/reviews/${review}/verdicts`, { verdict: 'request-changes', body: 'Throws?' }).expect(201);
    await tickAll(review).expect(201);
    const given = await reviewer.post(`/api/reviews/${review}/verdicts`, { verdict: 'approve' }).expect(201);
    expect(given.body.data.left_open).toBeNull();
    expect(
      (
        await reviewer
          .post(`/api/reviews/${review}/verdicts`, { verdict: 'approve', confirm_left_open: 'yes' })
          .expect(400)
      ).body.error.details.fields.confirm_left_open,
    ).toBeDefined();
  });
});

describe('ticks carried to a new revision', () => {
  it('carries the items whose parts of the setup did not change, says why, and leaves the rest unticked', async () => {
    const { modelId, revision } = await model();
    const first = await reviewOf(revision.id);
    await tickAll(first).expect(201);
    await reviewer.post(`/api/reviews/${first}/verdicts`, { verdict: 'approve' }).expect(201);

    // Only a failsafe changes: receivers change, the model block, link, controls, channels and mixes do not.
    const two = await saveVia(
      author,
      modelId,
      1,
      edit(SCALE(), '{ pin: 3, ch: 11, failsafe: hold }', '{ pin: 3, ch: 11, failsafe: 1500 }'),
      'Landing light fails on',
    );
    const next = await reviewOf(two.id);
    const checklist: {
      id: string;
      ticked: boolean;
      ticked_by: { id: string } | null;
      carried: { review_id: string; revision_number: number; reason: string } | null;
    }[] = (await reviewer.get(`/api/reviews/${next}`).expect(200)).body.data.checklist;
    const byId = new Map(checklist.map((item) => [item.id, item]));
    expect(byId.get('centre-of-gravity')).toMatchObject({
      ticked: true,
      ticked_by: { id: reviewer.user.id },
      carried: {
        review_id: first,
        revision_number: 1,
        reason:
          'Carried from the review of revision 1: revision 2 leaves the model block (airframe, weight) unchanged.',
      },
    });
    expect(byId.get('arm-switch-stops-motor')).toMatchObject({ ticked: true, carried: { revision_number: 1 } });
    for (const id of ['failsafe-tested', 'control-directions', 'range-check', 'receiver-power'])
      expect(byId.get(id), id).toMatchObject({ ticked: false, carried: null });
    // Made before each flight: never carried.
    expect(byId.get('battery-charge')).toMatchObject({ ticked: false, carried: null });

    const event = await AuditEvent.findOne({
      where: { workspaceId: workspace.id, action: 'review.requested', subjectId: next },
    });
    expect(event?.details).toMatchObject({ carried_ticks: ['arm-switch-stops-motor', 'centre-of-gravity'] });

    // A carried tick is a tick like any other: the reviewer can take it back.
    await reviewer.post(`/api/reviews/${next}/checklist`, { item: 'centre-of-gravity', ticked: false }).expect(200);
  });
});

describe('the comparison base', () => {
  it('shows a first review whole, as new; compares with the previous, the approved or any chosen revision', async () => {
    const { modelId, revision } = await model();
    const firstReview = await reviewOf(revision.id);
    const firstPage = (await viewer.get(`/api/reviews/${firstReview}`).expect(200)).body.data;
    expect(firstPage.base).toBeNull();
    expect(firstPage.compare).toBeNull();
    expect(firstPage.base_options).toEqual({ approved: null, previous: null });
    expect(firstPage.plan.compared).toBe(false);
    const statuses = [
      firstPage.plan.link.status,
      ...firstPage.plan.channels.map((entry: { status: string }) => entry.status),
      ...firstPage.plan.mixes.map((entry: { status: string }) => entry.status),
      ...firstPage.plan.receivers.flatMap((receiver: { status: string; pins: { status: string }[] }) => [
        receiver.status,
        ...receiver.pins.map((pin) => pin.status),
      ]),
    ];
    expect(new Set(statuses)).toEqual(new Set(['new']));
    const wing = firstPage.plan.receivers.find((receiver: { id: string }) => receiver.id === 'wing');
    expect(wing.pins.find((pin: { pin: number }) => pin.pin === 3)).toMatchObject({
      path: 'receivers[id=wing].map[pin=3]',
      ch: 11,
      function: 'landing-light',
      failsafe: 'hold',
      link_loss: { kind: 'held' },
    });

    await tickAll(firstReview).expect(201);
    await reviewer.post(`/api/reviews/${firstReview}/verdicts`, { verdict: 'approve' }).expect(201);
    const two = await saveVia(
      author,
      modelId,
      1,
      edit(SCALE(), '{ pin: 3, ch: 11, failsafe: hold }', '{ pin: 3, ch: 11, failsafe: 1500 }'),
      'Landing light fails on',
    );
    const three = await saveVia(
      author,
      modelId,
      2,
      edit(SCALE(), '{ pin: 3, ch: 11, failsafe: hold }', '{ pin: 3, ch: 11, failsafe: 1200 }'),
      'Dimmer on loss',
    );
    const review = await reviewOf(three.id);

    const byDefault = (await viewer.get(`/api/reviews/${review}`).expect(200)).body.data;
    expect(byDefault.base).toMatchObject({ kind: 'approved', revision: { number: 1 } });
    expect(byDefault.base_options).toEqual({
      approved: { id: revision.id, number: 1 },
      previous: { id: two.id, number: 2 },
    });
    const pin = (
      page: { plan: { receivers: { id: string; pins: { pin: number; status: string }[] }[] } },
      id: string,
      n: number,
    ) => page.plan.receivers.find((receiver) => receiver.id === id)!.pins.find((entry) => entry.pin === n)!;
    expect(pin(byDefault, 'wing', 3).status).toBe('changed');
    expect(pin(byDefault, 'wing', 1).status).toBe('same');

    const previous = (await viewer.get(`/api/reviews/${review}?base=previous`).expect(200)).body.data;
    expect(previous.base).toMatchObject({ kind: 'previous', revision: { number: 2 } });
    expect(previous.compare.changes).toEqual([
      expect.objectContaining({ path: 'receivers[id=wing].map[pin=3].failsafe', before: 1500, after: 1200 }),
    ]);
    const chosen = (await viewer.get(`/api/reviews/${review}?base=2`).expect(200)).body.data;
    expect(chosen.base).toMatchObject({ kind: 'chosen', revision: { id: two.id } });
    const byId = (await viewer.get(`/api/reviews/${review}?base=${revision.id}`).expect(200)).body.data;
    expect(byId.base).toMatchObject({ kind: 'chosen', revision: { number: 1 } });
    const none = (await viewer.get(`/api/reviews/${review}?base=none`).expect(200)).body.data;
    expect(none.base).toBeNull();
    expect(pin(none, 'wing', 1).status).toBe('new');

    const refuse = async (base: string, status: number, code?: string) => {
      const response = await viewer.get(`/api/reviews/${review}?base=${encodeURIComponent(base)}`).expect(status);
      if (code) expect(response.body.error.code).toBe(code);
      return response;
    };
    await refuse('3', 422, 'base-is-reviewed');
    await refuse('9', 422, 'base-not-found');
    await refuse('yesterday', 400);
    expect((await refuse('0', 400)).body.error.details.fields.base).toBeDefined();
    const otherModel = await model();
    await refuse(otherModel.revision.id, 422, 'base-not-found');
    const other = await reviewOf(otherModel.revision.id);
    expect((await viewer.get(`/api/reviews/${other}?base=approved`).expect(422)).body.error.code).toBe(
      'no-approved-base',
    );
    expect((await viewer.get(`/api/reviews/${other}?base=previous`).expect(422)).body.error.code).toBe(
      'no-previous-base',
    );
  });

  it('marks a removed pin and says who approved the revision cleared to fly', async () => {
    const { modelId, revision } = await model();
    const first = await reviewOf(revision.id);
    await tickAll(first).expect(201);
    await reviewer.post(`/api/reviews/${first}/verdicts`, { verdict: 'approve' }).expect(201);
    const two = await saveVia(
      author,
      modelId,
      1,
      edit(SCALE(), '      - { pin: 3, ch: 11, failsafe: hold }\n', ''),
      'Landing light unplugged',
    );
    const review = await reviewOf(two.id);
    const page = (await viewer.get(`/api/reviews/${review}`).expect(200)).body.data;
    expect(page.plan.removed).toEqual([{ path: 'receivers[id=wing].map[pin=3]', words: 'Pin 3 of wing' }]);

    const shown = (await viewer.get(`/api/models/${modelId}`).expect(200)).body.data;
    expect(shown.review_state).toBe('pending');
    expect(shown.approved).toMatchObject({
      id: revision.id,
      number: 1,
      approvers: [{ id: reviewer.user.id, name: 'Ines Greylag' }],
    });
    const listed = (await viewer.get(`/api/workspaces/${workspace.id}/models`).expect(200)).body.data;
    expect(listed.find((entry: { id: string }) => entry.id === modelId).approved).toMatchObject({ number: 1 });
  });
});

describe('comment threads', () => {
  it('replies, resolves and reopens a thread anchored to a setting, carried to a newer revision', async () => {
    const { modelId, revision } = await model();
    const review = await reviewOf(revision.id);
    const started = await reviewer
      .post(`/api/reviews/${review}/comments`, { path: 'receivers[id=wing].map[pin=3]', body: 'Fail on, not hold?' })
      .expect(201);
    const thread = started.body.data.id as string;
    expect(started.body.data).toMatchObject({ replies: [], resolved: null, path: 'receivers[id=wing].map[pin=3]' });

    const replied = await author.post(`/api/comments/${thread}/replies`, { body: 'It holds on purpose.' }).expect(201);
    expect(replied.body.data.replies).toEqual([
      expect.objectContaining({ body: 'It holds on purpose.', author: { id: author.user.id, name: 'Ada Merrow' } }),
    ]);
    const replyId = replied.body.data.replies[0].id as string;
    expect(
      (await reviewer.post(`/api/comments/${replyId}/replies`, { body: 'Nested?' }).expect(422)).body.error,
    ).toMatchObject({
      code: 'not-a-thread',
      details: { thread_id: thread },
    });
    expect(
      (await reviewer.post(`/api/comments/${thread}/replies`, { body: ' ' }).expect(400)).body.error.details.fields
        .body,
    ).toBeDefined();

    const resolved = await reviewer.post(`/api/comments/${thread}/resolve`, {}).expect(200);
    expect(resolved.body.data.resolved).toMatchObject({ by: { id: reviewer.user.id } });
    expect((await reviewer.post(`/api/comments/${thread}/resolve`, {}).expect(409)).body.error.code).toBe(
      'already-resolved',
    );
    const onOne = (status: string) => viewer.get(`/api/revisions/${revision.id}/comments?status=${status}`).expect(200);
    expect((await onOne('open')).body.data).toEqual([]);
    expect((await onOne('resolved')).body.data.map((entry: { id: string }) => entry.id)).toEqual([thread]);
    const reopened = await second.post(`/api/comments/${thread}/reopen`, {}).expect(200);
    expect(reopened.body.data.resolved).toBeNull();
    expect((await second.post(`/api/comments/${thread}/reopen`, {}).expect(409)).body.error.code).toBe('already-open');

    await viewer.post(`/api/comments/${thread}/replies`, { body: 'Me too' }).expect(403);
    await viewer.post(`/api/comments/${thread}/resolve`, {}).expect(403);
    const outsider = clientFor(t.app, t.config, await createUser());
    await outsider.post(`/api/comments/${thread}/resolve`, {}).expect(404);
    await outsider.get(`/api/revisions/${revision.id}/comments`).expect(404);

    const two = await saveVia(author, modelId, 1, edit(SCALE(), 'failsafe: 1000 }', 'failsafe: 990 }'), 'Motor lower');
    const carried = (await viewer.get(`/api/revisions/${two.id}/comments`).expect(200)).body;
    expect(carried.data).toEqual([
      expect.objectContaining({
        id: thread,
        carried: true,
        replies: [expect.objectContaining({ body: 'It holds on purpose.' })],
      }),
    ]);
    const actions = (await AuditEvent.findAll({ where: { workspaceId: workspace.id, subjectId: thread } })).map(
      (event) => event.action,
    );
    expect(actions.sort()).toEqual(['comment.reopened', 'comment.replied', 'comment.resolved']);
  });

  it('answers the review with thread counts only, and pages open and resolved threads apart as the review page reads them', async () => {
    const { revision } = await model();
    const review = await reviewOf(revision.id);
    const ids: string[] = [];
    for (const ch of [1, 2, 3, 4, 5]) {
      const started = await reviewer
        .post(`/api/reviews/${review}/comments`, { path: `channels[ch=${ch}]`, body: `Channel ${ch} direction?` })
        .expect(201);
      ids.push(started.body.data.id as string);
    }
    await reviewer.post(`/api/reviews/${review}/comments`, { body: 'Looks tidy.' }).expect(201);
    for (const id of [ids[0], ids[3]]) await reviewer.post(`/api/comments/${id}/resolve`, {}).expect(200);

    const detail = (await viewer.get(`/api/reviews/${review}`).expect(200)).body.data;
    expect(detail).not.toHaveProperty('comments');
    // One entry per open anchored thread; the whole-revision comment counts but has no path.
    expect(detail.threads).toEqual({
      open: 4,
      resolved: 2,
      open_paths: ['channels[ch=2]', 'channels[ch=3]', 'channels[ch=5]'],
    });

    const page = (status: string, offset: number) =>
      viewer.get(`/api/revisions/${revision.id}/comments?status=${status}&limit=2&offset=${offset}`).expect(200);
    const first = (await page('open', 0)).body;
    expect(first.pagination).toEqual({ limit: 2, offset: 0, total: 4 });
    expect(first.data.map((entry: { body: string }) => entry.body)).toEqual([
      'Channel 2 direction?',
      'Channel 3 direction?',
    ]);
    const next = (await page('open', 2)).body;
    expect(next.pagination).toEqual({ limit: 2, offset: 2, total: 4 });
    expect(next.data.map((entry: { body: string }) => entry.body)).toEqual(['Channel 5 direction?', 'Looks tidy.']);
    expect((await page('open', 4)).body).toEqual({ data: [], pagination: { limit: 2, offset: 4, total: 4 } });
    const resolved = (await page('resolved', 0)).body;
    expect(resolved.pagination.total).toBe(2);
    expect(resolved.data.map((entry: { id: string }) => entry.id)).toEqual([ids[0], ids[3]]);
  });

  it('starts a thread on a revision outside any review, and pages the threads with a total', async () => {
    const { revision } = await model();
    for (const ch of [1, 2, 3])
      await reviewer
        .post(`/api/revisions/${revision.id}/comments`, {
          path: `channels[ch=${ch}]`,
          body: `Channel ${ch} direction?`,
        })
        .expect(201);
    const whole = await author.post(`/api/revisions/${revision.id}/comments`, { body: 'Looks tidy.' }).expect(201);
    expect(whole.body.data).toMatchObject({ review_id: null, path: null });
    await viewer.post(`/api/revisions/${revision.id}/comments`, { body: 'Nice' }).expect(403);
    expect(
      (
        await reviewer
          .post(`/api/revisions/${revision.id}/comments`, { path: 'mixes[id=nothing]', body: 'Where?' })
          .expect(422)
      ).body.error.code,
    ).toBe('path-not-found');

    const page = await viewer.get(`/api/revisions/${revision.id}/comments?limit=2&offset=1`).expect(200);
    expect(page.body.pagination).toEqual({ limit: 2, offset: 1, total: 4 });
    expect(page.body.data.map((entry: { body: string }) => entry.body)).toEqual([
      'Channel 2 direction?',
      'Channel 3 direction?',
    ]);
    expect(
      (await viewer.get(`/api/revisions/${revision.id}/comments?limit=500`).expect(400)).body.error.details.fields
        .limit,
    ).toBeDefined();
    expect(
      (await viewer.get(`/api/revisions/${revision.id}/comments?status=done`).expect(400)).body.error.details.fields
        .status,
    ).toBeDefined();
  });
});
