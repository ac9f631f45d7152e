// Models and revisions as the API answers them: the shapes live in shared/contract.
export type {
  Author,
  CreatedModel,
  ForkSource,
  LatestRevision,
  ReviewState,
  Revision,
  RevisionModelRef,
  RevisionOrigin,
  RevisionSummary,
  SavedRevision,
  SetupModelView,
} from '@shared/contract/model';
