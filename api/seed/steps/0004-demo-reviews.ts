import type { Transaction } from 'sequelize';
import { recordAuditEvent } from '../../audit/record-audit-event';
import { composeMailFrom } from '../../mail/seeded-mail';
import { reviewRequestedMail, verdictMail } from '../../mail/messages';
import {
  ChecklistTick,
  OutboxMessage,
  Review,
  ReviewComment,
  ReviewVerdict,
  Revision,
  SetupModel,
  User,
  Workspace,
} from '../../models';
import type { Verdict } from '../../models/ReviewVerdict';
import { betweenRevisions } from '../../reviews/between-revisions';
import { CHECKLIST_IDS, PRE_MAIDEN_CHECKLIST } from '../../reviews/checklist';
import { reviewStateFromVerdicts } from '../../reviews/sign-off';
import { DEMO_WORKSPACE_NAME } from '../demo-data';
import type { SeedContext } from '../index';

// The demo club's sign-offs, one of each kind: the trainer approved and cleared, the
// scale project waiting for its reviewer, the glider's approval gone stale with a later
// change, the fork sent back for changes; the twin is not reviewed yet. A few of the
// mails these sent sit in the outbox. All invented.

type Person = 'owner' | 'editor' | 'reviewer';
const EMAILS: Record<Person, string> = {
  owner: 'owner@demo.example',
  editor: 'editor@demo.example',
  reviewer: 'reviewer@demo.example',
};

interface PlannedVerdict {
  by: Person;
  verdict: Verdict;
  body: string;
  at: string;
}

interface PlannedReview {
  model: string;
  /** Revision number; the latest when absent. */
  number?: number;
  by: Person;
  reviewers: Person[];
  note: string;
  at: string;
  verdicts: PlannedVerdict[];
  ticks: string[];
  comments: { by: Person; path: string | null; body: string; at: string }[];
  /** Which of the mails this review sent are kept in the outbox. */
  mails: ('requested' | 'verdict')[];
}

const PLAN: PlannedReview[] = [
  {
    model: 'Meadowlark 40',
    by: 'owner',
    reviewers: ['reviewer'],
    note: 'New students start on Saturday; please look over the softer elevator.',
    at: '2026-03-14T10:05:00Z',
    verdicts: [
      {
        by: 'reviewer',
        verdict: 'approve',
        body: 'Rates and expo as planned. Failsafe and range checked at the field with Hattie.',
        at: '2026-03-15T09:40:00Z',
      },
    ],
    ticks: CHECKLIST_IDS,
    comments: [
      {
        by: 'reviewer',
        path: 'mixes[id=elevator]',
        body: 'Expo 25 feels right on the buddy lead.',
        at: '2026-03-15T09:35:00Z',
      },
    ],
    mails: ['verdict'],
  },
  {
    model: 'Kestrel Mk II',
    by: 'owner',
    reviewers: ['reviewer'],
    note: 'Maiden after the winter rebuild. The wing receiver came out of the retired club Curlew, so the failsafes matter.',
    at: '2026-03-21T10:00:00Z',
    verdicts: [],
    ticks: ['control-directions', 'throws-measured'],
    comments: [
      {
        by: 'reviewer',
        path: 'receivers[id=wing].map[pin=1]',
        body: 'Tailwheel pin fails safe to 1500: confirm it centres with the transmitter switched off.',
        at: '2026-03-21T18:12:00Z',
      },
      {
        by: 'reviewer',
        path: 'receivers[id=fuselage].map[pin=3]',
        body: 'Motor failsafe 1000 µs: check the ESC reads that as stopped, propeller off.',
        at: '2026-03-21T18:15:00Z',
      },
    ],
    mails: ['requested'],
  },
  {
    model: 'Sedge 3.4',
    number: 1,
    by: 'editor',
    reviewers: ['reviewer'],
    note: 'Crow landing setup for the first slope session.',
    at: '2025-03-01T20:00:00Z',
    verdicts: [
      {
        by: 'reviewer',
        verdict: 'approve',
        body: 'Crow mixes check out; ailerons go up, flaps down.',
        at: '2025-03-02T08:30:00Z',
      },
    ],
    ticks: CHECKLIST_IDS,
    comments: [],
    mails: [],
  },
  {
    model: 'Heron 3.6',
    by: 'owner',
    reviewers: ['reviewer', 'editor'],
    note: 'The Sedge layout on the longer wing; softer ailerons.',
    at: '2026-04-18T13:00:00Z',
    verdicts: [
      {
        by: 'editor',
        verdict: 'comment',
        body: 'Same servos as my Sedge, so the throws should carry over.',
        at: '2026-04-18T19:00:00Z',
      },
      {
        by: 'reviewer',
        verdict: 'request-changes',
        body: 'With the longer wing, measure the aileron throws again before the maiden.',
        at: '2026-04-19T08:10:00Z',
      },
    ],
    ticks: ['control-directions'],
    comments: [
      {
        by: 'reviewer',
        path: 'mixes[id=ail-left]',
        body: 'Weight 65 may be too little on the 3.6 m wing.',
        at: '2026-04-19T08:05:00Z',
      },
    ],
    mails: ['verdict'],
  },
];

const APP_URL = (process.env.APP_URL || `http://127.0.0.1:${process.env.PORT || 3000}`).replace(/\/+$/, '');

async function seedReview(
  plan: PlannedReview,
  workspace: Workspace,
  people: Record<Person, User>,
  transaction: Transaction,
): Promise<void> {
  const model = await SetupModel.findOne({ where: { workspaceId: workspace.id, name: plan.model }, transaction });
  if (!model) throw new Error(`Demo seed: the model "${plan.model}" is missing; step 0002 makes it.`);
  const revision = await Revision.findOne({
    where: { modelId: model.id, ...(plan.number ? { number: plan.number } : {}) },
    order: [['number', 'DESC']],
    transaction,
  });
  if (!revision) throw new Error(`Demo seed: "${plan.model}" has no revision ${plan.number ?? ''}.`);
  const requester = people[plan.by];
  const reviewers = plan.reviewers.map((person) => people[person]);

  const facts = plan.verdicts.map((verdict) => ({
    reviewerId: people[verdict.by].id,
    verdict: verdict.verdict,
    createdAt: new Date(verdict.at),
  }));
  const { state, decidedAt } = reviewStateFromVerdicts(facts);
  const review = await Review.create(
    {
      revisionId: revision.id,
      modelId: model.id,
      workspaceId: workspace.id,
      requestedBy: requester.id,
      reviewerIds: reviewers.map((user) => user.id),
      note: plan.note,
      state,
      decidedAt,
      createdAt: new Date(plan.at),
    },
    { transaction },
  );
  const reviewUrl = `${APP_URL}/w/${workspace.id}/reviews/${review.id}`;
  await recordAuditEvent(
    {
      workspaceId: workspace.id,
      actor: requester,
      action: 'review.requested',
      subjectType: 'review',
      subjectId: review.id,
      details: {
        model_id: model.id,
        model_name: model.name,
        revision_id: revision.id,
        number: revision.number,
        reviewers: reviewers.map((user) => ({ id: user.id, name: user.name })),
      },
      createdAt: new Date(plan.at),
    },
    transaction,
  );
  if (plan.mails.includes('requested')) {
    for (const reviewer of reviewers) {
      const mail = reviewRequestedMail({
        to: reviewer.email,
        reviewer: reviewer.name,
        requester: requester.name,
        model: model.name,
        revision: revision.number,
        workspace: workspace.name,
        note: plan.note,
        errors: revision.errorCount,
        warnings: revision.warningCount,
        between: await betweenRevisions(revision, transaction),
        url: reviewUrl,
      });
      await OutboxMessage.create(composeMailFrom(mail, new Date(plan.at)), { transaction });
    }
  }
  for (const item of plan.ticks)
    await ChecklistTick.create(
      { reviewId: review.id, item, tickedBy: reviewers[0].id, tickedAt: new Date(plan.verdicts[0]?.at ?? plan.at) },
      { transaction },
    );
  for (const comment of plan.comments) {
    await ReviewComment.create(
      {
        reviewId: review.id,
        revisionId: revision.id,
        modelId: model.id,
        path: comment.path,
        body: comment.body,
        authorId: people[comment.by].id,
        createdAt: new Date(comment.at),
      },
      { transaction },
    );
  }
  for (const planned of plan.verdicts) {
    const by = people[planned.by];
    await ReviewVerdict.create(
      {
        reviewId: review.id,
        reviewerId: by.id,
        verdict: planned.verdict,
        body: planned.body,
        contentHash: revision.contentHash,
        createdAt: new Date(planned.at),
      },
      { transaction },
    );
    await recordAuditEvent(
      {
        workspaceId: workspace.id,
        actor: by,
        action: 'review.verdict',
        subjectType: 'review',
        subjectId: review.id,
        details: {
          verdict: planned.verdict,
          model_id: model.id,
          model_name: model.name,
          revision_id: revision.id,
          number: revision.number,
          content_hash: revision.contentHash,
        },
        createdAt: new Date(planned.at),
      },
      transaction,
    );
    if (plan.mails.includes('verdict') && planned.verdict !== 'comment') {
      const mail = verdictMail({
        to: requester.email,
        recipient: requester.name,
        reviewer: by.name,
        verdict: planned.verdict,
        body: planned.body,
        model: model.name,
        revision: revision.number,
        workspace: workspace.name,
        ticked: plan.ticks.length,
        items: PRE_MAIDEN_CHECKLIST.length,
        url: reviewUrl,
      });
      await OutboxMessage.create(composeMailFrom(mail, new Date(planned.at)), { transaction });
    }
  }
}

export async function run({ sequelize }: SeedContext): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const workspace = await Workspace.findOne({
      where: { name: DEMO_WORKSPACE_NAME },
      order: [['createdAt', 'ASC']],
      transaction,
    });
    if (!workspace)
      throw new Error(`Demo seed: the workspace "${DEMO_WORKSPACE_NAME}" is missing; step 0001 makes it.`);
    const people = {} as Record<Person, User>;
    for (const [person, email] of Object.entries(EMAILS) as [Person, string][]) {
      const user = await User.findOne({ where: { email }, transaction });
      if (!user) throw new Error(`Demo seed: the demo account ${email} is missing; step 0001 makes it.`);
      people[person] = user;
    }
    for (const plan of PLAN) await seedReview(plan, workspace, people, transaction);
  });
}
