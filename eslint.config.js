// ESLint (flat config): errors for real problems and for the house rules, no
// style rules (formatting is not what lint is for here). `npm run lint`; `npm test` runs it.
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const features = readdirSync(new URL('./src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

/** A feature imports the API layer, src/components/ui and src/lib — never another feature. */
const featureBoundaries = features.map((feature) => ({
  files: [`src/features/${feature}/**/*.{ts,tsx}`],
  rules: {
    'no-restricted-imports': [
      'error',
      {
        patterns: [
          {
            regex: `^@/features/(?!${feature}/)`,
            message: `Features never import each other: share through src/api, src/components/ui or src/lib (DEVELOPERS.md).`,
          },
          {
            // ../../<other feature>/… from components/ or hooks/ (and deeper)
            regex: `^(\\.\\./)+(?!${feature}/)(${features.filter((f) => f !== feature).join('|')})/`,
            message: `Features never import each other: share through src/api, src/components/ui or src/lib (DEVELOPERS.md).`,
          },
        ],
      },
    ],
  },
}));

const ONLY_CONFIG_READS_ENV = {
  'no-restricted-properties': [
    'error',
    { object: 'process', property: 'env', message: 'Configuration is read in one place: add it to server/config.ts and pass it on.' },
  ],
};

export default tseslint.config(
  {
    // Build output, installed and generated files; personal scratch files that are never committed.
    ignores: ['dist/**', 'node_modules/**', 'drizzle/**', 'fixtures/**', 'test-artifacts/**', '.data/**', 'coverage/**', '.scratch*/**', '**/_try.ts'],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      // Unused names starting with _ are deliberate (an argument a signature requires).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
      ...ONLY_CONFIG_READS_ENV,
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  ...featureBoundaries,
  {
    // shared/ runs in the browser and on the server: it may import neither side.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { regex: '^@/', message: 'shared/ imports nothing from src/.' },
            { regex: '(^|/)(src|server)/', message: 'shared/ imports nothing from src/ or server/.' },
          ],
        },
      ],
    },
  },
  {
    // Tests beside shared code may check it against a reference that lives on the server side
    // (OpenCV through server/vision/opencv.ts); tests never ship in a bundle.
    files: ['shared/**/*.test.ts'],
    rules: { 'no-restricted-imports': 'off' },
  },
  {
    // The one reader of the environment for the app.
    files: ['server/config.ts'],
    rules: { 'no-restricted-properties': 'off' },
  },
  {
    // Exempt on purpose: the set-up scripts and the test/bench harness run before or around
    // the app and hand it its environment (a throwaway DATABASE_URL, CLIENT_DIST, the S3 fake);
    // vite's config runs in the build, not in the app; the admin CLI takes its password from
    // ARCBENCH_ADMIN_PASSWORD so it never appears in a process list.
    files: ['scripts/**', 'tests/**', 'vite.config.ts', 'vitest.config.ts', 'drizzle.config.ts', 'eslint.config.js', 'server/cli/admin-create.ts'],
    rules: { 'no-restricted-properties': 'off' },
  },
);
