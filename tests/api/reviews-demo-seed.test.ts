import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { OutboxMessage, Review, User, Workspace } from '@api/models';
import { seedDemo } from '@api/seed';
import { DEMO_WORKSPACE_NAME } from '@api/seed/demo-data';
import { bearer, tokenFor } from './helpers/factories';
import { useMailTestApp } from './helpers/mail';

const t = useMailTestApp();
let workspace: Workspace;
let owner: User;

beforeAll(async () => {
  await seedDemo(t.sequelize);
  workspace = (await Workspace.findOne({ where: { name: DEMO_WORKSPACE_NAME } }))!;
  owner = (await User.findOne({ where: { email: 'owner@demo.example' } }))!;
});

describe('the demo reviews (seed step 0004)', () => {
  it('shows every review state in the hangar: approved and cleared, pending, stale, changes requested, none', async () => {
    const hangar = await request(t.app)
      .get(`/api/workspaces/${workspace.id}/models`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    const states = Object.fromEntries(
      hangar.body.data.map((model: { name: string; review_state: string; cleared_for_maiden: boolean }) => [
        model.name,
        [model.review_state, model.cleared_for_maiden],
      ]),
    );
    expect(states).toEqual({
      'Meadowlark 40': ['approved', true],
      'Kestrel Mk II': ['pending', false],
      'Sedge 3.4': ['stale', false],
      'Heron 3.6': ['changes-requested', false],
      'Wren Twin': ['none', false],
    });
  });

  it('keeps the mails those reviews sent in the outbox, each in its recipient’s own, linking to a review that opens', async () => {
    const subjects: string[] = [];
    for (const email of ['owner@demo.example', 'editor@demo.example', 'reviewer@demo.example', 'viewer@demo.example']) {
      const recipient = (await User.findOne({ where: { email } }))!;
      const outbox = await request(t.app)
        .get('/api/outbox')
        .set(bearer(tokenFor(recipient, t.config)))
        .expect(200);
      for (const mail of outbox.body.data as { subject: string; to: string[]; links: string[] }[]) {
        expect(mail.to).toEqual([email]);
        subjects.push(mail.subject);
        const path = new URL(mail.links[0]).pathname;
        const reviewId = /^\/w\/[0-9a-f-]+\/reviews\/([0-9a-f-]+)$/.exec(path)?.[1];
        expect(reviewId).toBeDefined();
        await request(t.app)
          .get(`/api/reviews/${reviewId}`)
          .set(bearer(tokenFor(owner, t.config)))
          .expect(200);
      }
    }
    expect(subjects.sort()).toEqual([
      'Ines Marchbank approved Meadowlark 40, revision 3',
      'Ines Marchbank asked for changes to Heron 3.6, revision 3',
      'Review requested: Kestrel Mk II, revision 12',
    ]);
    expect(await OutboxMessage.count()).toBe(3);
    expect(await OutboxMessage.count({ where: { state: 'delivered' } })).toBe(3);
  });

  it('carries the pending review’s anchored comments and the approved review’s full checklist', async () => {
    const reviews = await Review.findAll({ where: { workspaceId: workspace.id } });
    const pending = reviews.find((review) => review.state === 'open')!;
    const page = await request(t.app)
      .get(`/api/reviews/${pending.id}`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    expect(page.body.data.threads.open_paths).toEqual([
      'receivers[id=wing].map[pin=1]',
      'receivers[id=fuselage].map[pin=3]',
    ]);
    const threads = await request(t.app)
      .get(`/api/revisions/${page.body.data.revision.id}/comments?status=open`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    expect(threads.body.data.map((comment: { path: string }) => comment.path)).toEqual(
      page.body.data.threads.open_paths,
    );
    // Nothing of the Kestrel is approved yet: its first review shows the whole setup as new.
    expect(page.body.data.base).toBeNull();
    expect(page.body.data.plan.compared).toBe(false);
    expect(page.body.data.base_options.previous).toMatchObject({ number: expect.any(Number) });
    const approved = reviews.find(
      (review) => review.state === 'approved' && review.decidedAt!.getUTCFullYear() === 2026,
    )!;
    const approvedPage = await request(t.app)
      .get(`/api/reviews/${approved.id}`)
      .set(bearer(tokenFor(owner, t.config)))
      .expect(200);
    expect(approvedPage.body.data.checklist.every((item: { ticked: boolean }) => item.ticked)).toBe(true);
  });
});
