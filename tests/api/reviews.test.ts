import { beforeEach, describe, expect, it } from 'vitest';
import { AuditEvent, ReviewVerdict, type Workspace } from '@api/models';
import { createUser } from './helpers/factories';
import { clubModel, reviewClub, reviewOf as requestReviewOf, type ReviewClub } from './helpers/review-club';
import { mailTo, TEST_APP_URL, useMailTestApp } from './helpers/mail';
import { clientFor, createModelVia, edit, fixture, SCALE, saveVia, type Client } from './models-support';

const t = useMailTestApp();

let workspace: Workspace;
let owner: Client;
let author: Client;
let reviewer: Client;
let second: Client;
let viewer: Client;
let club: ReviewClub;

beforeEach(async () => {
  club = await reviewClub(t);
  ({ workspace, owner, author, reviewer, second, viewer } = club);
});

/** The review id in a review mail's link. */
const mailReviewId = (text: string) => /\/reviews\/([0-9a-f-]{36})/.exec(text)![1];

/** A model by `author` with the scale demo setup as revision 1. */
const scaleModel = (name = 'Kestrel') => clubModel(club, { name });

function ask(revisionId: string, reviewers: Client[], by: Client = author, note = 'Maiden on Saturday') {
  return by.post(`/api/revisions/${revisionId}/reviews`, {
    reviewers: reviewers.map((client) => client.user.id),
    note,
  });
}

const reviewOf = (revisionId: string, reviewers: Client[] = [reviewer]) =>
  requestReviewOf(club, revisionId, { reviewers, note: 'Maiden on Saturday' });

// Approvals here are about who may sign off, not about the checklist: they confirm
// what is left, as the confirmation dialog does. The confirmation itself is tested
// in "deliberate verdicts".
const verdict = (client: Client, reviewId: string, body: { verdict: string } & Record<string, unknown>) =>
  client.post(
    `/api/reviews/${reviewId}/verdicts`,
    body.verdict === 'approve' && !('confirm_left_open' in body) ? { ...body, confirm_left_open: true } : body,
  );
const modelState = async (modelId: string) =>
  (await author.get(`/api/models/${modelId}`).expect(200)).body.data as {
    review_state: string;
    cleared_for_maiden: boolean;
  };

describe('asking for a review', () => {
  it('an editor asks chosen reviewers; each gets a mail with the review link', async () => {
    const { modelId, revision } = await scaleModel();
    const response = await ask(revision.id, [reviewer, second]).expect(201);
    const review = response.body.data;
    expect(review).toMatchObject({
      model: { id: modelId, name: 'Kestrel' },
      revision: { id: revision.id, number: 1, author: { id: author.user.id } },
      requested_by: { id: author.user.id, name: 'Ada Merrow' },
      reviewers: [
        { id: reviewer.user.id, name: 'Ines Greylag' },
        { id: second.user.id, name: 'Ravi Shoveler' },
      ],
      note: 'Maiden on Saturday',
      state: 'open',
      latest: { number: 1, same_content: true },
    });
    for (const client of [reviewer, second]) {
      const [mail] = await mailTo(client.user.email);
      expect(mail.subject).toBe('Review requested: Kestrel, revision 1');
      expect(mail.textBody).toContain(`${TEST_APP_URL}/w/${workspace.id}/reviews/${review.id}`);
      expect(mail.textBody).toContain('Their note: "Maiden on Saturday"');
      expect(mail.htmlBody).toContain('Open the review');
    }
    expect(await modelState(modelId)).toEqual(
      expect.objectContaining({ review_state: 'pending', cleared_for_maiden: false }),
    );
    const event = await AuditEvent.findOne({ where: { workspaceId: workspace.id, action: 'review.requested' } });
    expect(event?.details).toMatchObject({
      model_name: 'Kestrel',
      number: 1,
      reviewers: [{ name: 'Ines Greylag' }, { name: 'Ravi Shoveler' }],
    });
    const trail: { action: string; model: unknown }[] = (
      await owner.get(`/api/workspaces/${workspace.id}/audit`).expect(200)
    ).body.data;
    expect(trail.find((entry) => entry.action === 'review.requested')!.model).toEqual({ id: modelId, name: 'Kestrel' });
  });

  it('the mail carries "Between these revisions": the change findings against the base the review page uses', async () => {
    const { modelId, revision: first } = await scaleModel('Kestrel between');
    // Revision 1 is approved; revision 2 only adds a comment; revision 3 reverses the
    // motor channel while the fuselage's pin 3 keeps its 1000 us failsafe (stopped
    // before, full power after). The review of 3 compares with the approved revision 1.
    const approvedReview = await reviewOf(first.id);
    await verdict(reviewer, approvedReview, { verdict: 'approve' }).expect(201);
    await saveVia(author, modelId, 1, `# Checked at the bench.\n${SCALE()}`, 'A note');
    const reversed = await saveVia(
      author,
      modelId,
      2,
      edit(
        SCALE(),
        'function: motor,         role: throttle,',
        'function: motor,         role: throttle, travel: { reverse: true },',
      ),
      'Reverse the motor channel',
    );
    await ask(reversed.id, [second]).expect(201);

    const [mail] = await mailTo(second.user.email);
    expect(mail.subject).toBe('Review requested: Kestrel between, revision 3');
    expect(mail.textBody).toContain(
      'Between these revisions (compared with the last approved revision, revision 1), 1 finding:',
    );
    const line = mail.textBody.split('\n').find((text) => text.startsWith('Warning (failsafe-meaning-changed'));
    expect(line).toContain('at receivers[id=fuselage].map[pin=3].failsafe');
    // The same finding, word for word, as the review page's panel shows it.
    const page = (await second.get(`/api/reviews/${mailReviewId(mail.textBody)}`).expect(200)).body.data;
    expect(page.base).toMatchObject({ kind: 'approved', revision: { number: 1 } });
    expect(page.compare.change_findings).toHaveLength(1);
    expect(line).toContain(page.compare.change_findings[0].message);
    expect(mail.htmlBody).toContain('Between these revisions');

    // A revision that changes nothing in meaning since the approved one says so.
    const { modelId: other, revision: quietFirst } = await scaleModel('Kestrel quiet');
    await verdict(reviewer, await reviewOf(quietFirst.id), { verdict: 'approve' }).expect(201);
    const quiet = await saveVia(author, other, 1, `# Re-read.\n${SCALE()}`, 'A note');
    await ask(quiet.id, [second]).expect(201);
    const [quietMail] = await mailTo(second.user.email);
    expect(quietMail.subject).toBe('Review requested: Kestrel quiet, revision 2');
    expect(quietMail.textBody).toContain(
      'Between these revisions (compared with the last approved revision, revision 1): no mistake shows only between the two.',
    );

    // With nothing approved before it, the mail says what the review page opens with:
    // the whole setup as new (the page's default base), not the last small edit.
    const { modelId: unapproved } = await scaleModel('Kestrel unapproved');
    const edited = await saveVia(author, unapproved, 1, `# Re-read.\n${SCALE()}`, 'A note');
    await ask(edited.id, [reviewer]).expect(201);
    const [unapprovedMail] = await mailTo(reviewer.user.email);
    expect(unapprovedMail.subject).toBe('Review requested: Kestrel unapproved, revision 2');
    expect(unapprovedMail.textBody).toContain(
      'Between these revisions: no revision before revision 2 is approved, so the review shows the whole setup as new',
    );
    const unapprovedPage = (await reviewer.get(`/api/reviews/${mailReviewId(unapprovedMail.textBody)}`).expect(200))
      .body.data;
    expect(unapprovedPage.base).toBeNull();
  });

  it('refuses reviewers below the reviewer role, outsiders, the author, repeats and a second open review', async () => {
    const { revision } = await scaleModel();
    const low = await ask(revision.id, [viewer]).expect(422);
    expect(low.body.error).toMatchObject({ code: 'invalid-reviewers', details: { user_ids: [viewer.user.id] } });
    expect(low.body.error.message).toContain('Vera Coot');
    const outsider = clientFor(t.app, t.config, await createUser());
    expect((await ask(revision.id, [outsider]).expect(422)).body.error.code).toBe('invalid-reviewers');
    expect((await ask(revision.id, [author], owner).expect(422)).body.error.code).toBe('reviewer-is-author');
    expect((await ask(revision.id, [reviewer, reviewer]).expect(400)).body.error.details.fields.reviewers).toMatch(
      /once/,
    );
    expect(
      (await author.post(`/api/revisions/${revision.id}/reviews`, { reviewers: [] }).expect(400)).body.error.details
        .fields.reviewers,
    ).toMatch(/at least one/);

    const first = await ask(revision.id, [reviewer]).expect(201);
    const again = await ask(revision.id, [second]).expect(409);
    expect(again.body.error).toMatchObject({ code: 'review-open', details: { review_id: first.body.data.id } });
    expect(await mailTo(viewer.user.email)).toHaveLength(0);
  });

  it('viewers and reviewers cannot ask (403); outsiders see nothing (404)', async () => {
    const { revision } = await scaleModel();
    expect((await ask(revision.id, [second], viewer).expect(403)).body.error.code).toBe('role-too-low');
    await ask(revision.id, [second], reviewer).expect(403);
    const outsider = clientFor(t.app, t.config, await createUser());
    await ask(revision.id, [reviewer], outsider).expect(404);
  });

  it('lists the workspace’s reviews, open and past, and the model’s', async () => {
    const { modelId, revision } = await scaleModel();
    const open = await reviewOf(revision.id);
    const other = await scaleModel('Merlin');
    const done = await reviewOf(other.revision.id);
    await verdict(reviewer, done, { verdict: 'approve' }).expect(201);

    const all = await viewer.get(`/api/workspaces/${workspace.id}/reviews`).expect(200);
    expect(all.body.data.map((review: { id: string }) => review.id)).toEqual([done, open]);
    expect(all.body.pagination.total).toBe(2);
    const openOnly = await viewer.get(`/api/workspaces/${workspace.id}/reviews?status=open`).expect(200);
    expect(openOnly.body.data.map((review: { id: string }) => review.id)).toEqual([open]);
    const closed = await viewer.get(`/api/workspaces/${workspace.id}/reviews?status=closed`).expect(200);
    expect(closed.body.data).toMatchObject([{ id: done, state: 'approved', verdict_count: 1 }]);
    const ofModel = await viewer.get(`/api/models/${modelId}/reviews`).expect(200);
    expect(ofModel.body.data.map((review: { id: string }) => review.id)).toEqual([open]);
    await viewer.get(`/api/workspaces/${workspace.id}/reviews?status=later`).expect(400);
  });
});

describe('the rules of sign-off', () => {
  it('nobody approves their own revision (403 own-revision)', async () => {
    const { revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    const response = await verdict(author, review, { verdict: 'approve' }).expect(403);
    expect(response.body.error.code).toBe('own-revision');
    expect(await ReviewVerdict.count({ where: { reviewId: review } })).toBe(0);
    await verdict(author, review, { verdict: 'comment', body: 'Pins checked on the bench.' }).expect(201);
  });

  it('nobody approves a change they wrote that someone else saved again (403 own-change, issue 12)', async () => {
    const created = await createModelVia(owner, workspace.id, { name: 'Shrike', yaml: SCALE(), message: 'First plan' });
    const modelId = created.model.id;
    await verdict(reviewer, await reviewOf(created.revision.id), { verdict: 'approve' }).expect(201);
    const changed = edit(SCALE(), '{ pin: 7, ch: 15, failsafe: 1500 }', '{ pin: 7, ch: 15, failsafe: 1400 }');
    const second = await saveVia(author, modelId, 1, changed, 'Cowl flap fails safe further closed');
    const resaved = await saveVia(owner, modelId, 2, `# Looked over by the owner.\n${changed}`, 'Comment only');
    expect(resaved.content_hash).toBe(second.content_hash);

    const review = await reviewOf(resaved.id);
    const refused = await verdict(author, review, { verdict: 'approve' }).expect(403);
    expect(refused.body.error.code).toBe('own-change');
    expect(await ReviewVerdict.count({ where: { reviewId: review } })).toBe(0);
    expect(await modelState(modelId)).toEqual(expect.objectContaining({ cleared_for_maiden: false }));
    const page = await author.get(`/api/reviews/${review}`).expect(200);
    expect(page.body.data.can).toMatchObject({ approve: false, approve_refusal: { code: 'own-change' } });

    // Nor can the author of the change be asked to review the re-saved revision.
    const asked = await ask(resaved.id, [author], owner);
    expect(asked.status).toBe(422);
    expect(asked.body.error.code).toBe('reviewer-is-author');

    await verdict(reviewer, review, { verdict: 'approve' }).expect(201);
    expect(await modelState(modelId)).toEqual(expect.objectContaining({ cleared_for_maiden: true }));
  });

  it('a revision with check errors cannot be approved (422 has-errors), but changes can be asked', async () => {
    const created = await createModelVia(author, workspace.id, {
      name: 'Meadowlark',
      yaml: fixture('invalid/channel-shared.yaml'),
    });
    expect(created.revision).toMatchObject({ number: 1 });
    const review = await reviewOf(created.revision.id);
    const refused = await verdict(reviewer, review, { verdict: 'approve' }).expect(422);
    expect(refused.body.error).toMatchObject({ code: 'has-errors', details: { errors: 1 } });
    const changes = await verdict(reviewer, review, {
      verdict: 'request-changes',
      body: 'Channel 4 carries two functions.',
    }).expect(201);
    expect(changes.body.data.review.state).toBe('changes-requested');
    expect((await modelState(created.model.id)).review_state).toBe('changes-requested');
  });

  it('viewers give no verdicts (403)', async () => {
    const { revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    expect(
      (await verdict(viewer, review, { verdict: 'comment', body: 'Looks fine' }).expect(403)).body.error.code,
    ).toBe('role-too-low');
  });

  it('an approval clears the model for its maiden and mails the requester, pinned to the content hash', async () => {
    const { modelId, revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    const approved = await verdict(reviewer, review, {
      verdict: 'approve',
      body: 'Checked against the wing receiver on the bench.',
    }).expect(201);
    expect(approved.body.data).toMatchObject({
      verdict: 'approve',
      reviewer: { id: reviewer.user.id },
      content_hash: revision.content_hash,
      review: { state: 'approved' },
    });
    expect(await modelState(modelId)).toEqual(
      expect.objectContaining({ review_state: 'approved', cleared_for_maiden: true }),
    );
    const [mail] = await mailTo(author.user.email);
    expect(mail.subject).toBe('Ines Greylag approved Kestrel, revision 1');
    expect(mail.textBody).toContain('Checked against the wing receiver on the bench.');
    expect(mail.textBody).toContain(`/w/${workspace.id}/reviews/${review}`);

    const hangar = await viewer.get(`/api/workspaces/${workspace.id}/models`).expect(200);
    expect(hangar.body.data.find((model: { id: string }) => model.id === modelId)).toMatchObject({
      review_state: 'approved',
      cleared_for_maiden: true,
    });
  });

  it('a later revision that changes the setup makes the approval stale', async () => {
    const { modelId, revision } = await scaleModel();
    await verdict(reviewer, await reviewOf(revision.id), { verdict: 'approve' }).expect(201);
    await saveVia(
      author,
      modelId,
      1,
      edit(SCALE(), '{ pin: 7, ch: 15, failsafe: 1500 }', '{ pin: 7, ch: 15, failsafe: 1400 }'),
      'Cowl flaps fail safe shut',
    );
    expect(await modelState(modelId)).toEqual(
      expect.objectContaining({ review_state: 'stale', cleared_for_maiden: false }),
    );
  });

  it('a formatting-only revision (comments, spacing) keeps the approval', async () => {
    const { modelId, revision } = await scaleModel();
    await verdict(reviewer, await reviewOf(revision.id), { verdict: 'approve' }).expect(201);
    const reformatted = `# Re-read at the field, nothing changed.\n${edit(SCALE(), '{ pin: 7, ch: 15, failsafe: 1500 }', '{ pin: 7,   ch: 15,   failsafe: 1500 }   # cowl')}`;
    const saved = await saveVia(author, modelId, 1, reformatted, 'Notes only');
    expect(saved.content_hash).toBe(revision.content_hash);
    expect(await modelState(modelId)).toEqual(
      expect.objectContaining({ review_state: 'approved', cleared_for_maiden: true }),
    );
  });

  it('is cleared only while the latest revision is approved: a revision with errors is not', async () => {
    const { modelId, revision } = await scaleModel();
    await verdict(reviewer, await reviewOf(revision.id), { verdict: 'approve' }).expect(201);
    const broken = edit(SCALE(), '{ pin: 2, ch: 10, failsafe: hold }', '{ pin: 2, ch: 9, failsafe: hold }');
    const saved = await saveVia(author, modelId, 1, broken, 'Tailwheel on two pins');
    expect(saved.findings.length).toBeGreaterThan(0);
    const state = await modelState(modelId);
    expect(state.cleared_for_maiden).toBe(false);
    expect(state.review_state).toBe('stale');
  });

  it('a request for changes outweighs an approval until that reviewer approves too', async () => {
    const { modelId, revision } = await scaleModel();
    const review = await reviewOf(revision.id, [reviewer, second]);
    await verdict(reviewer, review, { verdict: 'approve' }).expect(201);
    expect(
      (await verdict(second, review, { verdict: 'request-changes', body: 'Throttle failsafe first.' }).expect(201)).body
        .data.review.state,
    ).toBe('changes-requested');
    expect((await modelState(modelId)).review_state).toBe('changes-requested');
    await verdict(second, review, { verdict: 'comment', body: 'Measured again.' }).expect(201);
    expect((await modelState(modelId)).review_state).toBe('changes-requested');
    expect((await verdict(second, review, { verdict: 'approve' }).expect(201)).body.data.review.state).toBe('approved');
    expect((await modelState(modelId)).review_state).toBe('approved');
  });

  it('a verdict, once given, cannot be changed even by SQL', async () => {
    const { revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    const given = await verdict(reviewer, review, { verdict: 'approve' }).expect(201);
    await expect(
      t.sequelize.query(`UPDATE review_verdicts SET verdict = 'comment' WHERE id = '${given.body.data.id}'`),
    ).rejects.toThrow(/verdicts are permanent/);
    await expect(t.sequelize.query(`DELETE FROM review_verdicts WHERE id = '${given.body.data.id}'`)).rejects.toThrow(
      /verdicts are permanent/,
    );
  });

  it('refuses an unknown verdict or checklist item and stores nothing', async () => {
    const { revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    const bad = await verdict(reviewer, review, { verdict: 'lgtm', checklist: { 'engine-run': true } }).expect(400);
    expect(Object.keys(bad.body.error.details.fields).sort()).toEqual(['checklist.engine-run', 'verdict']);
    expect(await ReviewVerdict.count({ where: { reviewId: review } })).toBe(0);
  });
});

describe('the review page', () => {
  it('compares with the previous revision when asked, and by default with the last approved revision', async () => {
    const { modelId, revision } = await scaleModel();
    const second1 = await saveVia(
      author,
      modelId,
      1,
      edit(SCALE(), '{ pin: 3, ch: 11, failsafe: hold }', '{ pin: 3, ch: 11, failsafe: 1500 }'),
      'Landing light fails on',
    );
    const first = await reviewOf(second1.id);
    const page = await viewer.get(`/api/reviews/${first}?base=previous`).expect(200);
    expect(page.body.data.base).toMatchObject({ kind: 'previous', revision: { id: revision.id, number: 1 } });
    expect(page.body.data.compare.changes).toEqual([
      expect.objectContaining({
        kind: 'changed',
        path: 'receivers[id=wing].map[pin=3].failsafe',
        before: 'hold',
        after: 1500,
      }),
    ]);
    expect(page.body.data.compare.text).toBeDefined();
    expect(page.body.data.findings).toEqual(expect.any(Array));
    expect(page.body.data.checklist.map((item: { id: string }) => item.id)).toEqual([
      'control-directions',
      'throws-measured',
      'failsafe-tested',
      'range-check',
      'range-check-each-receiver',
      'bind-check',
      'arm-switch-stops-motor',
      'centre-of-gravity',
      'battery-charge',
      'receiver-power',
    ]);
    // [cap-658] failsafe with the model restrained; [ama-safety-code] range check before the first flight
    expect(page.body.data.checklist.find((item: { id: string }) => item.id === 'failsafe-tested').source.label).toBe(
      'cap-658',
    );
    expect(page.body.data.checklist.find((item: { id: string }) => item.id === 'range-check').source.label).toBe(
      'ama-safety-code',
    );
    // The second edition's items for two-receiver models: each names its source or says common practice.
    const item = (id: string) => page.body.data.checklist.find((entry: { id: string }) => entry.id === id);
    expect(item('range-check-each-receiver')).toMatchObject({
      label: 'Range check each receiver on its own',
      source: { label: 'ama-safety-code' },
      basis: null,
    });
    expect(item('bind-check')).toMatchObject({
      label: 'Bind check: every receiver answers',
      source: null,
      basis: 'Common practice, no published source.',
    });
    expect(item('arm-switch-stops-motor')).toMatchObject({
      label: 'Arm switch stops the motor',
      source: null,
      basis: 'Common practice, no published source.',
    });
    expect(page.body.data.can).toMatchObject({ verdict: false, approve: false, comment: false });
    expect((await reviewer.get(`/api/reviews/${first}`).expect(200)).body.data.can).toMatchObject({
      verdict: true,
      approve: true,
      comment: true,
      tick: true,
    });
    expect((await author.get(`/api/reviews/${first}`).expect(200)).body.data.can).toMatchObject({
      verdict: true,
      approve: false,
      approve_refusal: { code: 'own-revision' },
    });

    await verdict(reviewer, first, { verdict: 'approve' }).expect(201);
    const third = await saveVia(
      author,
      modelId,
      2,
      edit(SCALE(), '{ pin: 3, ch: 11, failsafe: hold }', '{ pin: 3, ch: 11, failsafe: 1200 }'),
      'Dimmer on loss',
    );
    await saveVia(
      author,
      modelId,
      3,
      edit(SCALE(), '{ pin: 3, ch: 11, failsafe: hold }', '{ pin: 3, ch: 11, failsafe: 1100 }'),
      'Dimmer still',
    );
    const fourth = (await author.get(`/api/models/${modelId}`).expect(200)).body.data.latest;
    const later = await reviewOf(fourth.id);
    const laterPage = await reviewer.get(`/api/reviews/${later}`).expect(200);
    expect(laterPage.body.data.base).toMatchObject({ kind: 'approved', revision: { id: second1.id, number: 2 } });
    expect(laterPage.body.data.compare.changes).toEqual([
      expect.objectContaining({ path: 'receivers[id=wing].map[pin=3].failsafe', before: 1500, after: 1100 }),
    ]);
    expect(third.number).toBe(3);
  });

  it('ticks and unticks checklist items, with the verdict or on their own', async () => {
    const { revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    const ticked = await reviewer
      .post(`/api/reviews/${review}/checklist`, { item: 'range-check', ticked: true })
      .expect(200);
    expect(ticked.body.data.find((item: { id: string }) => item.id === 'range-check')).toMatchObject({
      ticked: true,
      ticked_by: { id: reviewer.user.id },
    });
    await verdict(reviewer, review, {
      verdict: 'comment',
      checklist: { 'failsafe-tested': true, 'range-check': false },
    }).expect(201);
    const page = await reviewer.get(`/api/reviews/${review}`).expect(200);
    const state = Object.fromEntries(
      page.body.data.checklist.map((item: { id: string; ticked: boolean }) => [item.id, item.ticked]),
    );
    expect(state).toMatchObject({ 'failsafe-tested': true, 'range-check': false, 'battery-charge': false });
    await viewer.post(`/api/reviews/${review}/checklist`, { item: 'range-check', ticked: true }).expect(403);
    expect(
      (await reviewer.post(`/api/reviews/${review}/checklist`, { item: 'engine-run', ticked: true }).expect(400)).body
        .error.details.fields.item,
    ).toBeDefined();
  });
});

describe('anchored comments', () => {
  it('are shown on later revisions while their path still exists, and not after it is gone', async () => {
    const { modelId, revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    const anchored = await reviewer
      .post(`/api/reviews/${review}/comments`, {
        path: 'receivers[id=wing].map[pin=3]',
        body: 'Landing light should fail on, not hold.',
      })
      .expect(201);
    expect(anchored.body.data).toMatchObject({
      path: 'receivers[id=wing].map[pin=3]',
      author: { id: reviewer.user.id },
      revision: { number: 1 },
      carried: false,
    });
    await reviewer.post(`/api/reviews/${review}/comments`, { body: 'General: looks tidy.' }).expect(201);

    const two = await saveVia(
      author,
      modelId,
      1,
      edit(SCALE(), '{ pin: 3, ch: 11, failsafe: hold }', '{ pin: 3, ch: 11, failsafe: 1500 }'),
      'Fail on',
    );
    const onTwo = await viewer.get(`/api/revisions/${two.id}/comments`).expect(200);
    expect(onTwo.body.data).toEqual([
      expect.objectContaining({
        path: 'receivers[id=wing].map[pin=3]',
        body: 'Landing light should fail on, not hold.',
        carried: true,
        revision: { id: revision.id, number: 1 },
      }),
    ]);
    const reviewTwo = await reviewOf(two.id);
    // The review answers the counts only; the threads come a page at a time from the revision.
    const detailTwo = (await reviewer.get(`/api/reviews/${reviewTwo}`).expect(200)).body.data;
    expect(detailTwo).not.toHaveProperty('comments');
    expect(detailTwo.threads).toEqual({ open: 1, resolved: 0, open_paths: ['receivers[id=wing].map[pin=3]'] });
    expect(
      (await viewer.get(`/api/revisions/${two.id}/comments?status=open&limit=20&offset=0`).expect(200)).body,
    ).toEqual({
      data: [expect.objectContaining({ path: 'receivers[id=wing].map[pin=3]', carried: true })],
      pagination: { limit: 20, offset: 0, total: 1 },
    });

    const withoutPin = edit(
      edit(SCALE(), '      - { pin: 3, ch: 11, failsafe: hold }\n', ''),
      '  - { id: landing,    from: light-switch,   to: 11 }                           # on only at the far position\n',
      '',
    );
    const three = await saveVia(
      author,
      modelId,
      2,
      withoutPin.replace('  - { ch: 11, function: landing-light, role: light }\n', ''),
      'Landing light removed',
    );
    expect((await viewer.get(`/api/revisions/${three.id}/comments`).expect(200)).body.data).toEqual([]);
    expect((await viewer.get(`/api/revisions/${revision.id}/comments`).expect(200)).body.data).toHaveLength(2);
  });

  it('come a page at a time, oldest first, with how many there are', async () => {
    const { revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    for (const body of ['First note', 'Second note', 'Third note'])
      await reviewer.post(`/api/reviews/${review}/comments`, { body }).expect(201);
    const first = await viewer.get(`/api/revisions/${revision.id}/comments?limit=2`).expect(200);
    expect(first.body.data.map((comment: { body: string }) => comment.body)).toEqual(['First note', 'Second note']);
    expect(first.body.pagination).toEqual({ limit: 2, offset: 0, total: 3 });
    const rest = await viewer.get(`/api/revisions/${revision.id}/comments?limit=2&offset=2`).expect(200);
    expect(rest.body.data.map((comment: { body: string }) => comment.body)).toEqual(['Third note']);
    expect(rest.body.pagination).toEqual({ limit: 2, offset: 2, total: 3 });
    const refused = await viewer.get(`/api/revisions/${revision.id}/comments?limit=0`).expect(400);
    expect(refused.body.error.details.fields.limit).toBe('limit is at least 1.');
  });

  it('refuses a path that is not in the reviewed revision or cannot be read; viewers cannot comment', async () => {
    const { revision } = await scaleModel();
    const review = await reviewOf(revision.id);
    expect(
      (
        await reviewer
          .post(`/api/reviews/${review}/comments`, { path: 'receivers[id=tail].map[pin=1]', body: 'Where?' })
          .expect(422)
      ).body.error.code,
    ).toBe('path-not-found');
    expect(
      (
        await reviewer
          .post(`/api/reviews/${review}/comments`, { path: 'receivers[id=wing', body: 'Broken' })
          .expect(422)
      ).body.error.code,
    ).toBe('invalid-path');
    expect(
      (await reviewer.post(`/api/reviews/${review}/comments`, { body: '' }).expect(400)).body.error.details.fields.body,
    ).toBeDefined();
    await viewer.post(`/api/reviews/${review}/comments`, { body: 'Nice' }).expect(403);
  });
});
