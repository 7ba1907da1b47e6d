// ESLint: the framework's own rules plus the walls between layers (see DEVELOPERS.md, "Lint and layers").
import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

// An import names a layer by the alias (@/lib/server/x) or by a relative path (../../lib/server/x, ../server/x from lib/).
const layer = (path) => `^(@/|(\\.\\./)+)${path}(/|$)`;
const fromLib = (dir) => `^(@/lib/|(\\.\\./)+(lib/)?)${dir}(/|$)`;

const DB = { regex: layer('db'), message: 'The database is reached only through lib/server.' };
const SERVER = { regex: fromLib('server'), message: 'lib/server is for pages, route handlers and server actions only.' };
const APP = { regex: layer('app'), message: 'Nothing below the routes imports from app/.' };
const COMPONENTS = { regex: layer('components'), message: 'This layer does not import React components.' };
const FRAMEWORK = {
  regex: '^(next|react|react-dom|server-only|sequelize|mariadb)(/|$)',
  message: 'The pure engines import no framework, React or database package.',
};

/** The pure engines: plain TypeScript, usable from a page, a handler, a test or a script alike. */
const PURE_ENGINES = ['fits', 'calculators', 'measurements', 'chapters', 'media', 'safety', 'comments', 'units', 'bench'].map((d) => `lib/${d}/**`);
const ENGINE_WALLS = [APP, COMPONENTS, DB, SERVER, FRAMEWORK];
// The calculators themselves sit below their pages' descriptions (lib/calculators/pages): a calculator knows no page.
const CALCULATOR_PAGES = { regex: '^(\\./pages|@/lib/calculators/pages)(/|$)', message: 'A calculator knows nothing of the pages that show it (lib/calculators/pages).' };

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  globalIgnores(['.next*/**', '.data/**', 'node_modules/**', 'out/**', 'build/**', 'test-results/**', 'playwright-report/**', 'next-env.d.ts']),
  {
    rules: {
      // Unused names are errors, except ones deliberately marked with a leading underscore.
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none', ignoreRestSiblings: true }],
      // Control characters in a pattern are a slip unless a line says otherwise (plain-text cleaning does).
      'no-control-regex': 'error',
      // Photos are app addresses answering a no-store redirect to a short-lived signed URL: the image optimizer must not fetch or cache them.
      '@next/next/no-img-element': 'off',
      // This build has no React Compiler, so nothing is memoized behind react-hook-form's watch() or the table's hooks.
      'react-hooks/incompatible-library': 'off',
      // The editor and players keep their latest callbacks and values in refs written during render, on purpose.
      'react-hooks/refs': 'off',
      // Effects set state deliberately here: "hydrated" flags for the browser tests, and a prop copied into a form's choice.
      'react-hooks/set-state-in-effect': 'off',
    },
  },
  {
    files: ['tests/**'],
    rules: {
      // Tests read JSON answers loosely and assert on them field by field.
      '@typescript-eslint/no-explicit-any': 'off',
      // A source is a named constant (ANSI, INCH) cited by name in the comment beside each check, so it may never be read.
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^(_|[A-Z][A-Z0-9_]*$)', caughtErrors: 'none', ignoreRestSiblings: true }],
    },
  },
  {
    files: ['components/**'],
    rules: { 'no-restricted-imports': ['error', { patterns: [DB, SERVER] }] },
  },
  {
    files: PURE_ENGINES,
    rules: { 'no-restricted-imports': ['error', { patterns: ENGINE_WALLS }] },
  },
  {
    files: ['lib/calculators/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [...ENGINE_WALLS, CALCULATOR_PAGES] }] },
  },
  {
    files: ['lib/server/**'],
    rules: { 'no-restricted-imports': ['error', { patterns: [APP, COMPONENTS] }] },
  },
]);
