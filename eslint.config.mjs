// ESLint flat config: Next's rules (React, hooks, import, jsx-a11y, core web vitals), typescript-eslint's
// recommended rules (syntax only, no type information: tsc already checks types in CI) and the React hooks rules.
import { defineConfig, globalIgnores } from 'eslint/config';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTypescript from 'eslint-config-next/typescript';
import reactHooks from 'eslint-plugin-react-hooks';

export default defineConfig([
  globalIgnores([
    '.next/**',
    'node_modules/**',
    '.pg*/**',
    '.run/**',
    'tests/.artifacts/**',
    'bench/.out/**',
    'backups/**',
    'next-env.d.ts',
  ]),
  ...nextVitals,
  ...nextTypescript,
  // Next's preset already turns these on; listed here so the hooks rules stay on if the preset changes.
  {
    name: 'combtrace/react-hooks',
    files: ['**/*.{js,jsx,mjs,ts,tsx,mts,cts}'],
    rules: reactHooks.configs.flat.recommended.rules,
  },
  {
    name: 'combtrace/rules',
    // An eslint-disable comment that no longer silences anything fails the run, so none outlive their reason.
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // Warnings that Next's preset lowers are errors here, so CI stops on them.
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' },
      ],
      '@typescript-eslint/no-unused-expressions': 'error',
      // Only says that the React Compiler would skip a component (react-hook-form's watch()). We do not run the
      // compiler (next.config.mjs has no reactCompiler), so there is nothing to act on.
      'react-hooks/incompatible-library': 'off',
    },
  },
  {
    name: 'combtrace/models',
    files: ['models/**/*.ts'],
    // A model takes shared declared fields by interface–class merging (`export interface Lot extends Timestamps {}`
    // beside `export class Lot extends Model<…>`, see models/columns.ts): the interface only declares, as `declare`
    // does, which is what Sequelize wants; the empty interface exists to name what it extends.
    rules: {
      '@typescript-eslint/no-unsafe-declaration-merging': 'off',
      '@typescript-eslint/no-empty-object-type': ['error', { allowInterfaces: 'with-single-extends' }],
    },
  },
]);
