// Lint: typescript-eslint with type information, the rules of hooks, and the layers of
// the code as import rules (DEVELOPERS.md, "Layers"). Formatting is Prettier's job.
import js from '@eslint/js';
import globals from 'globals';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import { importX } from 'eslint-plugin-import-x';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';

// Each zone: code under `target` may not import from `from`. Dependencies point down:
// shared (pure) <- api, web; inside the API routes -> commands / queries -> models.
const LAYERS = [
  {
    target: './shared',
    from: ['./api', './web', './scripts', './tests'],
    message: 'shared/ is pure code used by every side.',
  },
  {
    target: './web',
    from: ['./api', './scripts'],
    message: 'The client talks to the API over HTTP; shapes come from shared/.',
  },
  {
    target: './api',
    from: ['./web', './scripts', './tests'],
    message: 'The API does not depend on the client, scripts or tests.',
  },
  {
    target: './api/models',
    from: ['./api/routes', './api/commands', './api/queries', './api/policies', './api/presenters'],
    message: 'Models are the bottom layer.',
  },
  { target: './api/commands', from: ['./api/routes'], message: 'Commands do not call back up into routes.' },
  {
    target: './api/queries',
    from: ['./api/routes', './api/commands'],
    message: 'Queries read; they do not import commands or routes.',
  },
  {
    target: './api/policies',
    from: [
      './api/routes',
      './api/commands',
      './api/queries',
      './api/access',
      './api/models',
      './api/middleware',
      './api/db',
      './api/errors.ts',
    ],
    message: 'Policies are pure decisions of (role, action, record): no request, no SQL, no HTTP errors.',
  },
  {
    target: './api/access',
    from: ['./api/routes', './api/commands', './api/queries', './api/policies', './api/middleware'],
    message: 'The loaders read records and memberships; deciding is for policies, answering for routes.',
  },
  {
    target: './api/presenters',
    from: ['./api/routes', './api/commands'],
    message: 'Presenters shape records; they do not command.',
  },
  {
    target: './api/revisions',
    from: ['./api/routes', './api/commands', './api/queries', './api/policies', './api/portability'],
    message: 'The revision store (check, lock, base check, append) is called by commands and imports; it calls none.',
  },
  {
    target: './api/audit',
    from: ['./api/routes', './api/commands', './api/queries', './api/policies', './api/revisions', './api/portability'],
    message: 'The audit recorder writes entries for whoever calls it; it depends on nobody above.',
  },
  {
    target: './api/portability',
    from: ['./api/routes'],
    message: 'Portability is called by routes, not the other way.',
  },
  {
    target: './web/components',
    from: ['./web/features', './web/app'],
    message: 'The UI kit and layouts know no feature.',
  },
];

export default tseslint.config(
  { ignores: ['node_modules/', 'dist/', '.data/', '.tmp/', 'backups/', 'screenshots/', 'test-results/', 'coverage/'] },
  js.configs.recommended,
  ...tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: {
        projectService: { allowDefaultProject: ['*.js', '*.mjs', 'scripts/*.mjs'] },
        tsconfigRootDir: import.meta.dirname,
      },
    },
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver-next': [createTypeScriptImportResolver({ project: 'tsconfig.json' })] },
    rules: {
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-restricted-paths': ['error', { zones: LAYERS }],
      // Names with a leading underscore are parameters or fields left out on purpose.
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
      // `declare global { namespace Express ... }` is how Express's Request is extended.
      '@typescript-eslint/no-namespace': ['error', { allowDeclarations: true }],
      // Several patterns exist to find and refuse control characters in names and files.
      'no-control-regex': 'off',
    },
  },
  {
    // Policies decide on a role: they never see Express's request or the database.
    files: ['api/policies/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: ['express', 'sequelize'].map((name) => ({
            name,
            message: 'Policies are pure: the route loads the record and answers the refusal.',
          })),
        },
      ],
    },
  },
  {
    // Tests read JSON answers (supertest's body is `any`) whose shape they then assert,
    // fakes are async to match the interfaces they stand in for, and a few tests write
    // deliberately wrong values deep into parsed documents.
    files: ['tests/**/*.{ts,tsx}'],
    rules: {
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
      '@typescript-eslint/require-await': 'off',
      '@typescript-eslint/no-explicit-any': 'off',
    },
  },
  {
    files: ['web/**/*.{ts,tsx}', 'tests/web/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    files: ['**/*.js', '**/*.mjs'],
    ...tseslint.configs.disableTypeChecked,
    languageOptions: { ...tseslint.configs.disableTypeChecked.languageOptions, globals: { ...globals.node } },
  },
);
