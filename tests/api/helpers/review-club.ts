import type { Express } from 'express';
import { expect } from 'vitest';
import type { AppConfig } from '@api/config';
import type { User, Workspace } from '@api/models';
import { clientFor, createModelVia, SCALE, type Client } from '../models-support';
import { addMember, createUser, createWorkspace } from './factories';

// The club the review and sign-off tests work in (invented: the Wherry Lane Flyers): an
// owner, an editor who writes the setups, two reviewers and a viewer, each with a client.

export interface ReviewClub {
  workspace: Workspace;
  owner: Client;
  author: Client;
  reviewer: Client;
  second: Client;
  viewer: Client;
}

export async function reviewClub(t: { app: Express; config: AppConfig }): Promise<ReviewClub> {
  const people: Record<string, User> = {};
  for (const name of ['Olwen Thatch', 'Ada Merrow', 'Ines Greylag', 'Ravi Shoveler', 'Vera Coot'])
    people[name] = await createUser({ name });
  const workspace = await createWorkspace({ name: 'Wherry Lane Flyers', owner: people['Olwen Thatch'] });
  await addMember(workspace, people['Ada Merrow'], 'editor');
  await addMember(workspace, people['Ines Greylag'], 'reviewer');
  await addMember(workspace, people['Ravi Shoveler'], 'reviewer');
  await addMember(workspace, people['Vera Coot'], 'viewer');
  const [owner, author, reviewer, second, viewer] = [
    'Olwen Thatch',
    'Ada Merrow',
    'Ines Greylag',
    'Ravi Shoveler',
    'Vera Coot',
  ].map((name) => clientFor(t.app, t.config, people[name]));
  return { workspace, owner, author, reviewer, second, viewer };
}

/** A model of the club's, by its editor, with `yaml` (the scale demo setup when left out) as revision 1. */
export async function clubModel(club: ReviewClub, { name = 'Kestrel', yaml = SCALE() } = {}) {
  const created = await createModelVia(club.author, club.workspace.id, { name, yaml, message: 'First plan' });
  return { modelId: created.model.id, revision: created.revision };
}

/** Asks `reviewers` to review a revision (by the club's editor unless `by` is given); the review's id. */
export async function reviewOf(
  club: ReviewClub,
  revisionId: string,
  { reviewers = [club.reviewer], by = club.author, note }: { reviewers?: Client[]; by?: Client; note?: string } = {},
): Promise<string> {
  const response = await by.post(`/api/revisions/${revisionId}/reviews`, {
    reviewers: reviewers.map((client) => client.user.id),
    ...(note === undefined ? {} : { note }),
  });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body.data.id as string;
}
