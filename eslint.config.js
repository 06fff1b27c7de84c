// Lint rules, including the import boundaries written down in DEVELOPERS.md.
import fs from 'node:fs';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import { importX } from 'eslint-plugin-import-x';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

const featuresDir = 'frontend/src/features';
const features = fs.existsSync(featuresDir)
  ? fs.readdirSync(featuresDir, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name)
  : [];

export default tseslint.config(
  { ignores: ['**/node_modules/**', '**/dist/**', '.data/**', 'bench-output/**', 'reference-data/**/*.py', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    languageOptions: { globals: { ...globals.node } },
    settings: {
      'import-x/resolver-next': [createTypeScriptImportResolver({ alwaysTryTypes: true, noWarnOnMultipleProjects: true, project: ['*/tsconfig.json'] })],
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_' }],
      '@typescript-eslint/no-namespace': 'off',
      'import-x/no-cycle': ['error', { maxDepth: 10 }],
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: [
            { target: './shared-types', from: ['./backend', './frontend', './database', './tests'], message: 'shared-types imports nothing of ours' },
            { target: './frontend', from: ['./backend', './database', './tests'], message: 'the frontend never imports the backend' },
            { target: './backend', from: ['./frontend'], message: 'the backend never imports the frontend' },
            { target: './database', from: ['./backend', './frontend'], message: 'database code does not import the app' },
            { target: './backend/src/analysis', from: ['./backend/src/db', './backend/src/routes', './backend/src/http', './backend/src/services'], message: 'the statistics core is pure: no database or HTTP' },
            { target: ['./frontend/src/components', './frontend/src/lib', './frontend/src/utils'], from: ['./frontend/src/features', './frontend/src/app'], message: 'shared UI, hooks and utilities never import features or the app' },
            { target: './frontend/src/features', from: './frontend/src/app', message: 'features never import the app layer' },
            ...features.map((f) => ({
              target: `./${featuresDir}/${f}`,
              from: `./${featuresDir}`,
              except: [`./${f}`],
              message: 'a feature never imports another feature; they meet in route modules',
            })),
          ],
        },
      ],
    },
  },
  {
    files: ['frontend/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser } },
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'warn' },
  },
);
