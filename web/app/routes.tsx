import { Suspense } from 'react';
import { Navigate, Outlet, type RouteObject } from 'react-router-dom';
import { AppFrame, type FrameLink } from './layouts/app-frame';
import { ModelFrame } from './layouts/model-frame';
import { LoadingState } from '../components/ui/loading-state';
import { WorkspaceScope } from '../features/workspaces/components/workspace-scope';
import { lazyScreen } from './lazy-screen';
import { RouteErrorScreen } from './routes/route-error';

// The route table: every screen of the app, in one place. A new screen is loaded lazily
// with `lazyScreen(() => import('../features/<feature>/components/...'), 'XScreen')` and
// listed in the workspace, model or dev list below; the navigation is drawn from these lists.

const SignInScreen = lazyScreen(() => import('./routes/auth/sign-in'), 'SignInScreen');
const CreateAccountScreen = lazyScreen(() => import('./routes/auth/create-account'), 'CreateAccountScreen');
const ResetPasswordScreen = lazyScreen(() => import('./routes/auth/reset-password'), 'ResetPasswordScreen');
const HomeScreen = lazyScreen(() => import('./routes/home'), 'HomeScreen');
const NotFoundScreen = lazyScreen(() => import('./routes/not-found'), 'NotFoundScreen');
const BackupsScreen = lazyScreen(() => import('../features/backups/components/backups-screen'), 'BackupsScreen');
const TeamScreen = lazyScreen(() => import('../features/team/components/team-screen'), 'TeamScreen');
const InvitationScreen = lazyScreen(() => import('../features/team/components/invitation-screen'), 'InvitationScreen');
const ResetPasswordConfirmScreen = lazyScreen(
  () => import('./routes/auth/reset-password-confirm'),
  'ResetPasswordConfirmScreen',
);
const OutboxScreen = lazyScreen(() => import('../features/outbox/components/outbox-screen'), 'OutboxScreen');
const ReviewsScreen = lazyScreen(() => import('../features/reviews/components/reviews-screen'), 'ReviewsScreen');
const ReviewScreen = lazyScreen(() => import('../features/reviews/components/review-screen'), 'ReviewScreen');
const ModelReviewsScreen = lazyScreen(
  () => import('../features/reviews/components/model-reviews-screen'),
  'ModelReviewsScreen',
);
const EditScreen = lazyScreen(() => import('../features/editor/components/edit-screen'), 'EditScreen');
const BenchScreen = lazyScreen(() => import('../features/bench/components/bench-screen'), 'BenchScreen');
const HangarScreen = lazyScreen(() => import('../features/models/components/hangar-screen'), 'HangarScreen');
const OverviewScreen = lazyScreen(() => import('../features/overview/components/overview-screen'), 'OverviewScreen');
const HistoryScreen = lazyScreen(() => import('../features/history/components/history-screen'), 'HistoryScreen');
const CompareScreen = lazyScreen(() => import('../features/compare/components/compare-screen'), 'CompareScreen');
const ShelfScreen = lazyScreen(() => import('../features/shelf/components/shelf-screen'), 'ShelfScreen');
const LabelSheetScreen = lazyScreen(
  () => import('../features/labels/components/label-sheet-screen'),
  'LabelSheetScreen',
);
const UnitScreen = lazyScreen(() => import('../features/shelf/components/unit-screen'), 'UnitScreen');
const FieldSheetScreen = lazyScreen(
  () => import('../features/field-sheet/components/field-sheet-screen'),
  'FieldSheetScreen',
);
const ModelSettingsScreen = lazyScreen(
  () => import('../features/model-settings/components/model-settings-screen'),
  'ModelSettingsScreen',
);
const FormatReferenceScreen = lazyScreen(
  () => import('../features/format-reference/components/format-reference-screen'),
  'FormatReferenceScreen',
);
const AccountScreen = lazyScreen(() => import('../features/account/components/account-screen'), 'AccountScreen');

interface Screen extends FrameLink {
  element: React.ReactElement;
}

/** Screens of one workspace, under `/w/:wsId/`. */
export const workspaceScreens: Screen[] = [
  { path: 'hangar', label: 'Hangar', element: <HangarScreen /> },
  { path: 'shelf', label: 'Shelf', element: <ShelfScreen /> },
  { path: 'reviews', label: 'Reviews', element: <ReviewsScreen /> },
  { path: 'team', label: 'Team', element: <TeamScreen /> },
  { path: 'backups', label: 'Backups', element: <BackupsScreen /> },
];

/** Screens of one model, under `/models/:modelId/`. */
export const modelScreens: Screen[] = [
  { path: 'overview', label: 'Overview', element: <OverviewScreen /> },
  { path: 'edit', label: 'Edit', element: <EditScreen /> },
  { path: 'bench', label: 'Bench', element: <BenchScreen /> },
  { path: 'history', label: 'History', element: <HistoryScreen /> },
  { path: 'compare', label: 'Compare', element: <CompareScreen /> },
  { path: 'reviews', label: 'Reviews', element: <ModelReviewsScreen /> },
  { path: 'sheet', label: 'Field sheet', element: <FieldSheetScreen /> },
  { path: 'settings', label: 'Settings', element: <ModelSettingsScreen /> },
];

/** Tools for development, outside any workspace. */
export const devScreens: Screen[] = [{ path: '/outbox', label: 'Outbox', element: <OutboxScreen /> }];

const frameLinks = (screens: Screen[]): FrameLink[] => screens.map(({ path, label }) => ({ path, label }));

function Root() {
  return (
    <Suspense fallback={<LoadingState />}>
      <Outlet />
    </Suspense>
  );
}

export const routes: RouteObject[] = [
  {
    path: '/',
    element: <Root />,
    errorElement: <RouteErrorScreen />,
    children: [
      { path: 'sign-in', element: <SignInScreen /> },
      { path: 'create-account', element: <CreateAccountScreen /> },
      { path: 'reset-password', element: <ResetPasswordScreen /> },
      { path: 'reset-password/:token', element: <ResetPasswordConfirmScreen /> },
      { path: 'invitations/:token', element: <InvitationScreen /> },
      {
        element: <AppFrame workspaceLinks={frameLinks(workspaceScreens)} devLinks={frameLinks(devScreens)} />,
        children: [
          { index: true, element: <HomeScreen /> },
          { path: 'account', element: <AccountScreen /> },
          { path: 'help/format', element: <FormatReferenceScreen /> },
          {
            path: 'w/:wsId',
            element: <WorkspaceScope />,
            children: [
              { index: true, element: <Navigate to="hangar" replace /> },
              ...workspaceScreens.map(({ path, element }) => ({ path, element })),
              { path: 'reviews/:reviewId', element: <ReviewScreen /> },
              { path: 'shelf/labels', element: <LabelSheetScreen /> },
              { path: 'shelf/:receiverId', element: <UnitScreen /> },
            ],
          },
          {
            path: 'models/:modelId',
            element: <ModelFrame links={frameLinks(modelScreens)} />,
            children: [
              { index: true, element: <Navigate to="overview" replace /> },
              ...modelScreens.map(({ path, element }) => ({ path, element })),
            ],
          },
          ...devScreens.map(({ path, element }) => ({ path, element })),
        ],
      },
      { path: '*', element: <NotFoundScreen /> },
    ],
  },
];
