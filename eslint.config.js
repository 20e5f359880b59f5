// Lint: typescript-eslint's recommended rules, plus the direction of imports that keeps the layers apart.
import { readdirSync, existsSync } from 'node:fs';
import tseslint from 'typescript-eslint';
import importX from 'eslint-plugin-import-x';

const features = existsSync('src/features') ? readdirSync('src/features', { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name) : [];

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'test-output/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  {
    plugins: { 'import-x': importX },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'import-x/no-cycle': ['error', { maxDepth: 10 }],
      // Features never import each other: what two features share moves to src/components or src/lib.
      'import-x/no-restricted-paths': [
        'error',
        {
          zones: features.map((f) => ({
            target: `./src/features/${f}`,
            from: './src/features',
            except: [`./${f}`],
            message: 'A feature must not import another feature; move what they share to src/components or src/lib.',
          })),
        },
      ],
    },
    settings: { 'import-x/resolver-next': [importX.createNodeResolver({ extensions: ['.ts', '.tsx', '.js', '.mjs', '.json'] })] },
  },
  {
    // Geometry is pure: plain data in, plain data out, the same on client and server.
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['**/src/**', '**/server/**'], message: 'shared/ imports nothing of src/ or server/.' },
            { group: ['react', 'react-dom', 'react-*', 'konva', 'node:*', 'fs', 'path', 'os', 'crypto', 'express', 'sequelize'], message: 'shared/ is pure TypeScript: no UI, no Node APIs, no server libraries.' },
          ],
        },
      ],
    },
  },
  {
    files: ['server/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/src/**'], message: 'The server never imports the client (src/).' }] }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/server/**'], message: 'The client never imports server code; share through shared/.' }] }],
    },
  },
);
